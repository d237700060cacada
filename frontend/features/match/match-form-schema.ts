import { z } from 'zod';
import {
  conductivityValueSchema,
  densityUnitSchema,
  densityValueSchema,
  electricalUnitSchema,
  temperatureUnitSchema,
  temperatureValueSchema,
  uncertaintyPercentSchema,
  type MatchRequest,
} from '../../../shared/schemas/match-request';

/** Text boxes hold strings; an empty optional box means "not given". */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const toNumber = (v: unknown) => {
  const blank = blankToUndefined(v);
  return blank === undefined ? undefined : Number(String(blank).replace(',', '.'));
};

/** The Match form: the API's field rules (shared/schemas) applied to what a person typed. */
export const matchFormSchema = z.object({
  conductivityValue: z
    .preprocess(toNumber, conductivityValueSchema.optional())
    .refine((v) => v !== undefined, {
      message: 'enter the reading',
    }),
  conductivityUnit: electricalUnitSchema,
  temperatureValue: z.preprocess(toNumber, temperatureValueSchema.optional()),
  temperatureUnit: temperatureUnitSchema,
  densityValue: z.preprocess(toNumber, densityValueSchema.optional()),
  densityUnit: densityUnitSchema,
  uncertaintyPercent: z.preprocess(toNumber, uncertaintyPercentSchema.optional()),
});

export type MatchFormInput = z.input<typeof matchFormSchema>;
export type MatchFormValues = z.output<typeof matchFormSchema>;

export const matchFormDefaults: MatchFormInput = {
  conductivityValue: '',
  conductivityUnit: '%IACS',
  temperatureValue: '20',
  temperatureUnit: 'C',
  densityValue: '',
  densityUnit: 'g/cm3',
  uncertaintyPercent: '2',
};

export function requestFromForm(v: MatchFormValues): MatchRequest {
  return {
    conductivity: { value: v.conductivityValue!, unit: v.conductivityUnit },
    ...(v.temperatureValue !== undefined
      ? { temperature: { value: v.temperatureValue, unit: v.temperatureUnit } }
      : {}),
    ...(v.densityValue !== undefined
      ? { density: { value: v.densityValue, unit: v.densityUnit } }
      : {}),
    ...(v.uncertaintyPercent !== undefined ? { uncertaintyPercent: v.uncertaintyPercent } : {}),
  };
}

import { z } from 'zod';
import {
  aliasesOf,
  conductivityUnits,
  densityUnits,
  resistivityUnits,
  temperatureUnits,
} from '../units/codes';

/**
 * The Match request, the same rules as openapi.yaml's MatchRequest: the form validates with it
 * before sending, and tests/unit/schemas.test.ts checks that the two agree on every limit.
 */
const electrical = [...conductivityUnits, ...resistivityUnits] as const;
export const electricalUnitSchema = z.enum([...electrical, ...aliasesOf(electrical)] as [
  string,
  ...string[],
]);
export const densityUnitSchema = z.enum([...densityUnits, ...aliasesOf(densityUnits)] as [
  string,
  ...string[],
]);
export const temperatureUnitSchema = z.enum([
  ...temperatureUnits,
  ...aliasesOf(temperatureUnits),
] as [string, ...string[]]);

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).finite(`${what} must be a finite number`);

export const conductivityValueSchema = finite('conductivity')
  .gt(0, 'conductivity must be greater than zero')
  .max(1e12, 'conductivity is implausibly large');
export const temperatureValueSchema = finite('temperature')
  .min(-459.67, 'temperature is below absolute zero')
  .max(2000, 'temperature is above 2000');
export const densityValueSchema = finite('density')
  .gt(0, 'density must be greater than zero')
  .max(1e6, 'density is implausibly large');
export const uncertaintyPercentSchema = finite('uncertainty')
  .min(0.1, 'uncertainty must be at least 0.1 %')
  .max(50, 'uncertainty must be at most 50 %');
export const matchLimitSchema = z.number().int().min(1).max(50);

export const matchRequestSchema = z
  .object({
    conductivity: z.object({ value: conductivityValueSchema, unit: electricalUnitSchema }).strict(),
    temperature: z
      .object({ value: temperatureValueSchema, unit: temperatureUnitSchema })
      .strict()
      .optional(),
    density: z.object({ value: densityValueSchema, unit: densityUnitSchema }).strict().optional(),
    uncertaintyPercent: uncertaintyPercentSchema.optional(),
    limit: matchLimitSchema.optional(),
  })
  .strict();

export type MatchRequest = z.infer<typeof matchRequestSchema>;

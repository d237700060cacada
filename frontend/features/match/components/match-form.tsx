import { fromSiemensPerMetre } from '../../../../shared/units/conductivity';
import { fromKilogramsPerCubicMetre } from '../../../../shared/units/density';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { inputClass, QuantityInput } from '../../../components/quantity-input';
import type { Reading } from '../../../lib/api-types';
import { formatEditable } from '../../../lib/format';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import {
  matchFormDefaults,
  matchFormSchema,
  requestFromForm,
  type MatchFormInput,
  type MatchFormValues,
} from '../match-form-schema';
import type { MatchRequest } from '../../../../shared/schemas/match-request';

const electricalUnits = ['%IACS', 'MS/m', 'S/m', 'uohm_cm', 'nohm_m', 'ohm_m'];
const temperatureUnits = ['C', 'K', 'F'];
const densityUnits = ['g/cm3', 'kg/m3', 'lb/in3'];

function FieldMessage({
  id,
  error,
  hint,
}: {
  id: string;
  error?: { message?: string };
  hint?: string;
}) {
  if (error)
    return (
      <p id={id} className="text-xs text-copper-700">
        {error.message}
      </p>
    );
  return hint ? (
    <p id={id} className="text-xs text-ink/60">
      {hint}
    </p>
  ) : null;
}

interface Props {
  readings: Reading[];
  pending: boolean;
  onSubmit: (request: MatchRequest) => void;
}

/** A reading in; every box keeps what was typed when the service refuses it. */
export function MatchForm({ readings, pending, onSubmit }: Props) {
  const [units] = useUnitPreferences();
  const defaults = {
    ...matchFormDefaults,
    conductivityUnit: units.conductivity,
    densityUnit: units.density,
  } as MatchFormInput;
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors },
  } = useForm<MatchFormInput, unknown, MatchFormValues>({
    resolver: zodResolver(matchFormSchema),
    defaultValues: defaults,
  });

  const fillFrom = (id: string) => {
    const r = readings.find((x) => String(x.id) === id);
    if (!r) return;
    reset({
      ...defaults,
      conductivityValue: formatEditable(
        fromSiemensPerMetre(r.conductivitySPerM, units.conductivity),
        4,
      ),
      temperatureValue: formatEditable(r.temperatureK - 273.15, 4),
      temperatureUnit: 'C',
      densityValue: r.densityKgPerM3
        ? formatEditable(fromKilogramsPerCubicMetre(r.densityKgPerM3, units.density), 4)
        : '',
    });
  };

  return (
    <form
      noValidate
      aria-labelledby="match-form-title"
      className="flex flex-col gap-4 rounded-md border border-patina-100 bg-white p-4"
      onSubmit={handleSubmit((values) => onSubmit(requestFromForm(values)))}
    >
      <h2 id="match-form-title" className="text-lg font-semibold">
        Reading
      </h2>
      {readings.length ? (
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Fill in from a recorded reading</span>
          <select className={inputClass} defaultValue="" onChange={(e) => fillFrom(e.target.value)}>
            <option value="">choose…</option>
            {readings.map((r) => (
              <option key={r.id} value={r.id}>
                {r.label}: {r.product}
                {r.invented ? ' (invented demo data)' : ''}
              </option>
            ))}
          </select>
        </label>
      ) : null}

      <QuantityInput
        id="conductivity"
        label="Conductivity or resistivity"
        hint="As the instrument shows it."
        error={errors.conductivityValue}
        value={register('conductivityValue')}
        unit={register('conductivityUnit')}
        units={electricalUnits}
        autoFocus
      />
      <QuantityInput
        id="temperature"
        label="Temperature of the piece"
        hint="Leave empty if unknown: taken as the table's 20 °C."
        error={errors.temperatureValue}
        value={register('temperatureValue')}
        unit={register('temperatureUnit')}
        units={temperatureUnits}
      />
      <QuantityInput
        id="density"
        label="Density (optional)"
        hint="From mass and volume; sharpens the ranking."
        error={errors.densityValue}
        value={register('densityValue')}
        unit={register('densityUnit')}
        units={densityUnits}
      />

      <div className="flex flex-col gap-1 text-sm sm:w-48">
        <label htmlFor="uncertainty" className="font-medium">
          Reading uncertainty (%)
        </label>
        <input
          id="uncertainty"
          className={inputClass}
          inputMode="decimal"
          aria-invalid={errors.uncertaintyPercent ? true : undefined}
          aria-describedby="uncertainty-msg"
          {...register('uncertaintyPercent')}
        />
        <FieldMessage
          id="uncertainty-msg"
          error={errors.uncertaintyPercent}
          hint="One standard uncertainty."
        />
      </div>

      <button
        type="submit"
        disabled={pending}
        className="self-start rounded bg-copper-500 px-4 py-2 font-medium text-white hover:bg-copper-700 disabled:opacity-60"
      >
        {pending ? 'Ranking…' : 'Find candidates'}
      </button>
    </form>
  );
}

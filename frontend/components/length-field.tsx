import { useId } from 'react';
import { unitLabel } from '../../shared/units/codes';
import type { LengthEntry } from '../lib/stack-drafts';

export const lengthChoices = ['mm', 'um', 'in', 'mil', 'm'];

interface Props {
  label: string;
  entry: LengthEntry;
  onChange: (next: LengthEntry) => void;
  error?: string;
  units?: readonly string[];
  /** How a unit code is shown; 'F' means farad only where the caller says so. */
  labelFor?: (unit: string) => string;
  compact?: boolean;
}

/** A controlled number box with its unit (a length unless told otherwise): the value stays as typed. */
export function LengthField({
  label,
  entry,
  onChange,
  error,
  units = lengthChoices,
  labelFor = unitLabel,
  compact,
}: Props) {
  const id = useId();
  return (
    <div className={`flex flex-col gap-1 text-sm ${compact ? '' : 'min-w-36'}`}>
      <label htmlFor={id} className={compact ? 'sr-only' : 'font-medium'}>
        {label}
      </label>
      <div className="flex">
        <input
          id={id}
          inputMode="decimal"
          aria-invalid={error ? true : undefined}
          className="w-20 min-w-0 flex-1 rounded-l border border-patina-300 bg-white px-2 py-1 aria-[invalid=true]:border-copper-500 aria-[invalid=true]:bg-copper-100"
          value={Number.isNaN(entry.value) ? '' : String(entry.value)}
          onChange={(e) =>
            onChange({
              ...entry,
              value: e.target.value.trim() === '' ? NaN : Number(e.target.value.replace(',', '.')),
            })
          }
        />
        <select
          aria-label={`${label}: unit`}
          className="rounded-r border border-l-0 border-patina-300 bg-patina-50 px-1 py-1"
          value={entry.unit}
          onChange={(e) => onChange({ ...entry, unit: e.target.value })}
        >
          {units.map((u) => (
            <option key={u} value={u}>
              {labelFor(u)}
            </option>
          ))}
        </select>
      </div>
      {error ? <p className="text-xs text-copper-700">{error}</p> : null}
    </div>
  );
}

/** A plain positive-number box (turns, gauge, counts). */
export function NumberField({
  label,
  value,
  onChange,
  error,
  suffix,
}: {
  label: string;
  value: number;
  onChange: (v: number) => void;
  error?: string;
  suffix?: string;
}) {
  const id = useId();
  return (
    <div className="flex min-w-28 flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <div className="flex items-center gap-1">
        <input
          id={id}
          inputMode="decimal"
          aria-invalid={error ? true : undefined}
          className="w-24 rounded border border-patina-300 bg-white px-2 py-1 aria-[invalid=true]:border-copper-500 aria-[invalid=true]:bg-copper-100"
          value={Number.isNaN(value) ? '' : String(value)}
          onChange={(e) =>
            onChange(e.target.value.trim() === '' ? NaN : Number(e.target.value.replace(',', '.')))
          }
        />
        {suffix ? <span className="text-ink/70">{suffix}</span> : null}
      </div>
      {error ? <p className="text-xs text-copper-700">{error}</p> : null}
    </div>
  );
}

/** Wire by gauge or by bare diameter: 'awg' for American Wire Gauge, else a length unit. */
export const wireChoices = ['awg', 'mm', 'mil'];
const wireLabel = (unit: string) => (unit === 'awg' ? 'AWG' : unitLabel(unit));

/** The message for a wire entry that cannot be used, or undefined when it is fine. */
export function wireProblem(entry: LengthEntry): string | undefined {
  if (entry.unit === 'awg')
    return Number.isInteger(entry.value) && entry.value >= -3 && entry.value <= 56
      ? undefined
      : 'a gauge from -3 (0000) to 56';
  return Number.isFinite(entry.value) && entry.value > 0 ? undefined : 'greater than zero';
}

/** The wire of a coil: a gauge (AWG) or a bare diameter in mm or mil. */
export function WireField({
  entry,
  onChange,
  error,
}: {
  entry: LengthEntry;
  onChange: (next: LengthEntry) => void;
  error?: string;
}) {
  return (
    <LengthField
      label="Wire (gauge or diameter)"
      entry={entry}
      units={wireChoices}
      labelFor={wireLabel}
      error={error}
      onChange={onChange}
    />
  );
}

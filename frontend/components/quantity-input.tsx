import type { UseFormRegisterReturn } from 'react-hook-form';
import { unitLabel } from '../../shared/units/codes';

export const inputClass =
  'w-full rounded border border-patina-300 bg-white px-2 py-1.5 aria-[invalid=true]:border-copper-500 aria-[invalid=true]:bg-copper-100';

interface Props {
  id: string;
  label: string;
  hint?: string;
  error?: { message?: string };
  value: UseFormRegisterReturn;
  unit: UseFormRegisterReturn;
  units: readonly string[];
  autoFocus?: boolean;
}

/** A number box with its unit beside it; the message under it is the error when there is one. */
export function QuantityInput({ id, label, hint, error, value, unit, units, autoFocus }: Props) {
  const messageId = `${id}-msg`;
  return (
    <div className="grid gap-3 sm:grid-cols-[1fr_8rem]">
      <div className="flex flex-col gap-1 text-sm">
        <label htmlFor={id} className="font-medium">
          {label}
        </label>
        <input
          id={id}
          className={inputClass}
          inputMode="decimal"
          autoFocus={autoFocus}
          aria-invalid={error ? true : undefined}
          aria-describedby={messageId}
          {...value}
        />
        {error ? (
          <p id={messageId} className="text-xs text-copper-700">
            {error.message}
          </p>
        ) : hint ? (
          <p id={messageId} className="text-xs text-ink/60">
            {hint}
          </p>
        ) : null}
      </div>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium" aria-hidden="true">
          Unit
        </span>
        <select className={inputClass} aria-label={`${label}: unit`} {...unit}>
          {units.map((u) => (
            <option key={u} value={u}>
              {unitLabel(u)}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}

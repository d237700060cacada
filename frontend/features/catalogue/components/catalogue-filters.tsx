import { unitLabel } from '../../../../shared/units/codes';
import { familyLabels } from '../../../lib/format';
import { isBadNumber, type CatalogueFilters } from '../filters';

interface Props {
  filters: CatalogueFilters;
  onChange: (next: Partial<CatalogueFilters>) => void;
}

function RangeInputs({
  label,
  min,
  max,
  unit,
  onMin,
  onMax,
}: {
  label: string;
  min: string;
  max: string;
  unit: string;
  onMin: (v: string) => void;
  onMax: (v: string) => void;
}) {
  const id = label.toLowerCase();
  const bad = isBadNumber(min) || isBadNumber(max);
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="text-sm font-medium">
        {label} <span className="font-normal text-ink/70">({unitLabel(unit)})</span>
      </legend>
      <div className="flex items-center gap-1.5">
        <label className="sr-only" htmlFor={`${id}-min`}>{`${label} from`}</label>
        <input
          id={`${id}-min`}
          inputMode="decimal"
          placeholder="from"
          aria-invalid={isBadNumber(min)}
          className="w-24 rounded border border-patina-300 bg-white px-2 py-1 aria-[invalid=true]:border-copper-500"
          value={min}
          onChange={(e) => onMin(e.target.value)}
        />
        <span aria-hidden="true">–</span>
        <label className="sr-only" htmlFor={`${id}-max`}>{`${label} to`}</label>
        <input
          id={`${id}-max`}
          inputMode="decimal"
          placeholder="to"
          aria-invalid={isBadNumber(max)}
          className="w-24 rounded border border-patina-300 bg-white px-2 py-1 aria-[invalid=true]:border-copper-500"
          value={max}
          onChange={(e) => onMax(e.target.value)}
        />
      </div>
      {bad ? <p className="text-xs text-copper-700">Enter a number greater than zero.</p> : null}
    </fieldset>
  );
}

/** Family chips, magnetic choice and the two ranges, each change written to the URL at once. */
export function CatalogueFiltersPanel({ filters, onChange }: Props) {
  const toggleFamily = (family: string) =>
    onChange({
      family: filters.family.includes(family)
        ? filters.family.filter((f) => f !== family)
        : [...filters.family, family],
    });
  return (
    <div className="flex flex-col gap-4">
      <fieldset>
        <legend className="mb-1 text-sm font-medium">Family</legend>
        <div className="flex flex-wrap gap-1.5">
          {Object.entries(familyLabels).map(([family, label]) => {
            const on = filters.family.includes(family);
            return (
              <button
                key={family}
                type="button"
                aria-pressed={on}
                onClick={() => toggleFamily(family)}
                className={`rounded-full border px-2.5 py-0.5 text-xs ${on ? 'border-patina-700 bg-patina-700 text-white' : 'border-patina-300 bg-white hover:border-patina-500'}`}
              >
                {label}
              </button>
            );
          })}
        </div>
      </fieldset>
      <div className="flex flex-wrap items-end gap-6">
        <label className="flex flex-col gap-1 text-sm font-medium">
          Magnetic
          <select
            className="rounded border border-patina-300 bg-white px-2 py-1 font-normal"
            value={filters.magnetic}
            onChange={(e) => onChange({ magnetic: e.target.value as CatalogueFilters['magnetic'] })}
          >
            <option value="">either</option>
            <option value="true">magnetic only</option>
            <option value="false">non-magnetic only</option>
          </select>
        </label>
        <RangeInputs
          label="Conductivity"
          min={filters.cmin}
          max={filters.cmax}
          unit={filters.cunit}
          onMin={(cmin) => onChange({ cmin })}
          onMax={(cmax) => onChange({ cmax })}
        />
        <RangeInputs
          label="Density"
          min={filters.dmin}
          max={filters.dmax}
          unit={filters.dunit}
          onMin={(dmin) => onChange({ dmin })}
          onMax={(dmax) => onChange({ dmax })}
        />
      </div>
    </div>
  );
}

import { unitLabel } from '../../shared/units/codes';
import { useUnitPreferences, type UnitPreferences } from '../lib/unit-preferences';

const conductivityChoices: UnitPreferences['conductivity'][] = [
  '%IACS',
  'MS/m',
  'S/m',
  'uohm_cm',
  'nohm_m',
];
const densityChoices: UnitPreferences['density'][] = ['g/cm3', 'kg/m3', 'lb/in3'];

/** The display units for conductivity and density, shared by every screen through the browser. */
export function UnitSwitcher({
  onChange,
}: {
  onChange?: (next: Partial<UnitPreferences>) => void;
}) {
  const [prefs, setPrefs] = useUnitPreferences();
  const change = (next: Partial<UnitPreferences>) => {
    onChange?.(next);
    setPrefs(next);
  };
  return (
    <fieldset className="flex flex-wrap items-center gap-3 text-sm">
      <legend className="sr-only">Display units</legend>
      <label className="flex items-center gap-1.5">
        <span className="text-ink/70">Conductivity in</span>
        <select
          className="rounded border border-patina-300 bg-white px-2 py-1"
          value={prefs.conductivity}
          onChange={(e) =>
            change({ conductivity: e.target.value as UnitPreferences['conductivity'] })
          }
        >
          {conductivityChoices.map((u) => (
            <option key={u} value={u}>
              {unitLabel(u)}
            </option>
          ))}
        </select>
      </label>
      <label className="flex items-center gap-1.5">
        <span className="text-ink/70">Density in</span>
        <select
          className="rounded border border-patina-300 bg-white px-2 py-1"
          value={prefs.density}
          onChange={(e) => change({ density: e.target.value as UnitPreferences['density'] })}
        >
          {densityChoices.map((u) => (
            <option key={u} value={u}>
              {unitLabel(u)}
            </option>
          ))}
        </select>
      </label>
    </fieldset>
  );
}

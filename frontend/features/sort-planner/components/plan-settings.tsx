import { LengthField, NumberField } from '../../../components/length-field';
import type { PlanSettings } from '../plan-model';

/** The probe coil, the ranges, the sweep and the method. */
export function PlanSettingsPanel({
  settings,
  errors,
  onChange,
  largeAllowed,
}: {
  settings: PlanSettings;
  errors: Record<string, string>;
  onChange: (next: PlanSettings) => void;
  largeAllowed: boolean;
}) {
  const set = (patch: Partial<PlanSettings>) => onChange({ ...settings, ...patch });
  const coil = (patch: Partial<PlanSettings['coil']>) =>
    set({ coil: { ...settings.coil, ...patch } });
  return (
    <div className="grid gap-4 rounded-md border border-patina-100 bg-white p-4 md:grid-cols-2">
      <fieldset className="flex flex-wrap gap-3">
        <legend className="mb-1 text-sm font-semibold">Probe coil (air core)</legend>
        <LengthField
          label="Inner radius"
          entry={settings.coil.innerRadius}
          error={errors['coil.innerRadius']}
          onChange={(e) => coil({ innerRadius: e })}
        />
        <LengthField
          label="Outer radius"
          entry={settings.coil.outerRadius}
          error={errors['coil.outerRadius']}
          onChange={(e) => coil({ outerRadius: e })}
        />
        <LengthField
          label="Coil length"
          entry={settings.coil.length}
          error={errors['coil.length']}
          onChange={(e) => coil({ length: e })}
        />
        <NumberField
          label="Turns"
          value={settings.coil.turns}
          error={errors['coil.turns']}
          onChange={(v) => coil({ turns: v })}
        />
      </fieldset>
      <fieldset className="flex flex-wrap gap-3">
        <legend className="mb-1 text-sm font-semibold">Ranges on the line</legend>
        <LengthField
          label="Smallest lift-off"
          entry={settings.liftOffMin}
          error={errors['liftOff.min']}
          onChange={(e) => set({ liftOffMin: e })}
        />
        <LengthField
          label="Largest lift-off"
          entry={settings.liftOffMax}
          error={errors['liftOff.max']}
          onChange={(e) => set({ liftOffMax: e })}
        />
        <NumberField
          label="Lowest temperature"
          suffix="°C"
          value={settings.temperatureMinC}
          error={errors['temperature.min']}
          onChange={(v) => set({ temperatureMinC: v })}
        />
        <NumberField
          label="Highest temperature"
          suffix="°C"
          value={settings.temperatureMaxC}
          error={errors['temperature.max']}
          onChange={(v) => set({ temperatureMaxC: v })}
        />
        <NumberField
          label="Plating thickness ±"
          suffix="%"
          value={settings.platingPercent}
          error={errors['tolerances.platingThicknessPercent']}
          onChange={(v) => set({ platingPercent: v })}
        />
      </fieldset>
      <fieldset className="flex flex-wrap gap-3">
        <legend className="mb-1 text-sm font-semibold">Frequencies (log sweep)</legend>
        <NumberField
          label="From"
          suffix="kHz"
          value={settings.fromKHz}
          error={errors['frequencies.from']}
          onChange={(v) => set({ fromKHz: v })}
        />
        <NumberField
          label="To"
          suffix="kHz"
          value={settings.toKHz}
          error={errors['frequencies.to']}
          onChange={(v) => set({ toKHz: v })}
        />
        <NumberField
          label="Frequencies"
          value={settings.points}
          error={errors['frequencies.points']}
          onChange={(v) => set({ points: v })}
        />
      </fieldset>
      <fieldset className="flex flex-wrap items-end gap-3">
        <legend className="mb-1 text-sm font-semibold">Method</legend>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name="plan-method"
            checked={settings.method === 'interval'}
            onChange={() => set({ method: 'interval' })}
          />
          Corners of the ranges (interval)
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="radio"
            name="plan-method"
            checked={settings.method === 'monteCarlo'}
            onChange={() => set({ method: 'monteCarlo' })}
          />
          Monte Carlo
        </label>
        {settings.method === 'monteCarlo' ? (
          <>
            <NumberField
              label="Samples per product"
              value={settings.samples}
              error={errors['method.samples']}
              onChange={(v) => set({ samples: v })}
            />
            <NumberField
              label="Seed"
              value={settings.seed}
              error={errors['method.seed']}
              onChange={(v) => set({ seed: v })}
            />
          </>
        ) : null}
        <p className="w-full text-xs text-ink/60">
          {largeAllowed
            ? 'Up to 12 products, 64 frequencies and 5,000 samples per product.'
            : 'Without an integrator account: up to 6 products, 16 frequencies and 200 samples per product.'}
        </p>
      </fieldset>
    </div>
  );
}

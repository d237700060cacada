import { LengthField, NumberField } from '../../../components/length-field';
import type { BenchForm } from '../lib/bench-form';

interface Props {
  form: BenchForm;
  errors: Record<string, string>;
  set: (patch: Partial<BenchForm>) => void;
}

function Toggle({
  checked,
  onChange,
  children,
}: {
  checked: boolean;
  onChange: (v: boolean) => void;
  children: string;
}) {
  return (
    <label className="flex w-full items-center gap-2 text-sm">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {children}
    </label>
  );
}

/** An iron core in the bore: off by default; on, each blank runs with and without it. */
export function CoreFields({ form, errors, set }: Props) {
  return (
    <fieldset className="flex flex-wrap gap-3">
      <legend className="mb-1 text-sm font-semibold">Core</legend>
      <Toggle checked={form.withCore} onChange={(withCore) => set({ withCore })}>
        An iron core in the bore (compared with the air-core coil)
      </Toggle>
      {form.withCore ? (
        <>
          <LengthField
            label="Core radius"
            entry={form.coreRadius}
            error={errors.coreRadius}
            onChange={(coreRadius) => set({ coreRadius })}
          />
          <LengthField
            label="Core length"
            entry={form.coreLength}
            error={errors.coreLength}
            onChange={(coreLength) => set({ coreLength })}
          />
          <NumberField
            label="Relative permeability"
            value={form.coreRelativePermeability}
            error={errors.coreRelativePermeability}
            onChange={(coreRelativePermeability) => set({ coreRelativePermeability })}
          />
          <LengthField
            label="Saturates at"
            entry={form.coreSaturation}
            units={['T', 'mT']}
            error={errors.coreSaturation}
            onChange={(coreSaturation) => set({ coreSaturation })}
          />
        </>
      ) : null}
    </fieldset>
  );
}

/** A thyristor's or triac's datasheet ratings, checked against the pulse. */
export function SwitchFields({ form, errors, set }: Props) {
  return (
    <fieldset className="flex flex-wrap gap-3">
      <legend className="mb-1 text-sm font-semibold">Switch</legend>
      <Toggle checked={form.checkSwitch} onChange={(checkSwitch) => set({ checkSwitch })}>
        Check the switch against its datasheet ratings
      </Toggle>
      {form.checkSwitch ? (
        <>
          <LengthField
            label="Surge current rating"
            entry={form.surgeCurrent}
            units={['A', 'kA']}
            error={errors.surgeCurrent}
            onChange={(surgeCurrent) => set({ surgeCurrent })}
          />
          <LengthField
            label="I²t rating"
            entry={form.i2tRating}
            units={['A2s', 'kA2s']}
            error={errors.i2tRating}
            onChange={(i2tRating) => set({ i2tRating })}
          />
        </>
      ) : null}
    </fieldset>
  );
}

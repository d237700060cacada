import { useState } from 'react';
import { capacitanceLabel } from '../../../../shared/units/codes';
import { LengthField, NumberField, WireField, wireProblem } from '../../../components/length-field';
import { BankCaution, bankInSi } from '../../../components/bank-caution';
import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { draftFromBuiltIn, useBuiltInStacks } from '../../../lib/built-in-stacks';
import { useSavedStacks, type LengthEntry, type StackDraft } from '../../../lib/stack-drafts';
import { useRunLaunches, type LaunchRequest } from '../api/run-launch';
import { BinPlacement } from '../components/bin-placement';
import { CurrentForceChart } from '../components/launch-charts';
import { LaunchSummary } from '../components/launch-summary';
import { HowDoWeKnow } from '../../../components/how-do-we-know';

interface BenchForm {
  capacitance: LengthEntry;
  voltage: LengthEntry;
  seriesResistance: LengthEntry;
  innerRadius: LengthEntry;
  outerRadius: LengthEntry;
  length: LengthEntry;
  turns: number;
  /** A gauge ('awg') or a bare diameter (mm, mil). */
  wire: LengthEntry;
  gap: LengthEntry;
  angleDeg: number;
  blankA: string;
  blankB: string;
}

const mm = (value: number): LengthEntry => ({ value, unit: 'mm' });
const initial: BenchForm = {
  capacitance: { value: 50, unit: 'uF' },
  voltage: { value: 400, unit: 'V' },
  seriesResistance: { value: 50, unit: 'mohm' },
  innerRadius: mm(5),
  outerRadius: mm(12),
  length: mm(10),
  turns: 100,
  wire: { value: 26, unit: 'awg' },
  gap: mm(0.5),
  angleDeg: 45,
  blankA: 'estmark-5-marks',
  blankB: 'estmark-1-mark',
};

const ok = (e: LengthEntry, zero = false) =>
  Number.isFinite(e.value) && (zero ? e.value >= 0 : e.value > 0);

function validate(f: BenchForm): Record<string, string> {
  const e: Record<string, string> = {};
  if (!ok(f.capacitance)) e.capacitance = 'greater than zero';
  if (!ok(f.voltage)) e.voltage = 'greater than zero';
  if (!ok(f.seriesResistance, true)) e.seriesResistance = 'zero or more';
  if (!ok(f.innerRadius)) e.innerRadius = 'greater than zero';
  if (!ok(f.outerRadius)) e.outerRadius = 'greater than zero';
  if (!ok(f.length)) e.length = 'greater than zero';
  if (!ok(f.gap, true)) e.gap = 'zero or more';
  if (!Number.isInteger(f.turns) || f.turns < 1) e.turns = 'a whole number, 1 or more';
  const wire = wireProblem(f.wire);
  if (wire) e.wire = wire;
  if (!Number.isFinite(f.angleDeg) || f.angleDeg < 1 || f.angleDeg > 90)
    e.angleDeg = '1 to 90 degrees';
  return e;
}

type Req = LaunchRequest;
/** The selects offer only codes openapi.yaml accepts; this narrows the typed-in entry to them. */
const as = <T,>(e: LengthEntry) => ({ value: e.value, unit: e.unit }) as T;
type Len = Req['gap'];

function requestFor(f: BenchForm, blank: StackDraft): LaunchRequest {
  return {
    bank: {
      capacitance: as<Req['bank']['capacitance']>(f.capacitance),
      voltage: as<Req['bank']['voltage']>(f.voltage),
      seriesResistance: as<Req['bank']['seriesResistance']>(f.seriesResistance),
    },
    coil: {
      innerRadius: as<Len>(f.innerRadius),
      outerRadius: as<Len>(f.outerRadius),
      length: as<Len>(f.length),
      turns: f.turns,
      ...(f.wire.unit === 'awg' ? { awg: f.wire.value } : { wireDiameter: as<Len>(f.wire) }),
    },
    blank: {
      diameter: as<Len>(blank.diameter),
      layers: blank.layers.map((l) => ({
        material: { alloy: l.alloy },
        thickness: as<Len>(l.thickness),
      })),
    },
    gap: as<Len>(f.gap),
    launchAngleDeg: f.angleDeg,
  };
}

export function PulseBenchRoute() {
  const builtIns = useBuiltInStacks();
  const [saved] = useSavedStacks();
  const [form, setForm] = useState(initial);
  const launches = useRunLaunches();
  const errors = validate(form);
  const set = (patch: Partial<BenchForm>) => setForm({ ...form, ...patch });

  const choices: StackDraft[] = [
    ...(builtIns.data?.items.map(draftFromBuiltIn) ?? []),
    ...saved.map((s) => ({ ...s, id: `saved-${s.id}`, name: `${s.name} (yours)` })),
  ];
  const blankA = choices.find((c) => c.id === form.blankA);
  const blankB = choices.find((c) => c.id === form.blankB);
  const chosen = [blankA, blankB].filter((b): b is StackDraft => Boolean(b));

  const blankSelect = (
    label: string,
    value: string,
    onChange: (v: string) => void,
    optional: boolean,
  ) => (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium">{label}</span>
      <select
        className="rounded border border-patina-300 bg-white px-2 py-1"
        value={value}
        onChange={(e) => onChange(e.target.value)}
      >
        {optional ? <option value="">none</option> : null}
        {choices.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </select>
    </label>
  );

  return (
    <section aria-labelledby="bench-title" className="flex flex-col gap-5">
      <header>
        <h1 id="bench-title" className="text-2xl font-semibold tracking-tight">
          Pulse Bench
        </h1>
        <p className="text-sm text-ink/70">
          A capacitor bank discharged through a drive coil under a blank: how hard it is thrown, and
          where it lands.
        </p>
        <HowDoWeKnow />
      </header>
      <BankCaution
        capacitanceF={bankInSi(form.capacitance, 'F')}
        voltageV={bankInSi(form.voltage, 'V')}
      />

      <form
        noValidate
        className="flex flex-col gap-4 rounded-md border border-patina-100 bg-white p-4"
        onSubmit={(e) => {
          e.preventDefault();
          if (Object.keys(errors).length || !blankA) return;
          launches.mutate(chosen.map((b) => requestFor(form, b)));
        }}
      >
        <fieldset className="flex flex-wrap gap-3">
          <legend className="mb-1 text-sm font-semibold">Bank</legend>
          <LengthField
            label="Capacitance"
            entry={form.capacitance}
            units={['uF', 'F']}
            labelFor={capacitanceLabel}
            error={errors.capacitance}
            onChange={(capacitance) => set({ capacitance })}
          />
          <LengthField
            label="Voltage"
            entry={form.voltage}
            units={['V', 'kV']}
            error={errors.voltage}
            onChange={(voltage) => set({ voltage })}
          />
          <LengthField
            label="Series resistance"
            entry={form.seriesResistance}
            units={['mohm', 'ohm']}
            error={errors.seriesResistance}
            onChange={(seriesResistance) => set({ seriesResistance })}
          />
        </fieldset>
        <fieldset className="flex flex-wrap gap-3">
          <legend className="mb-1 text-sm font-semibold">Drive coil</legend>
          <LengthField
            label="Inner radius"
            entry={form.innerRadius}
            error={errors.innerRadius}
            onChange={(innerRadius) => set({ innerRadius })}
          />
          <LengthField
            label="Outer radius"
            entry={form.outerRadius}
            error={errors.outerRadius}
            onChange={(outerRadius) => set({ outerRadius })}
          />
          <LengthField
            label="Length"
            entry={form.length}
            error={errors.length}
            onChange={(length) => set({ length })}
          />
          <NumberField
            label="Turns"
            value={form.turns}
            error={errors.turns}
            onChange={(turns) => set({ turns })}
          />
          <WireField entry={form.wire} error={errors.wire} onChange={(wire) => set({ wire })} />
        </fieldset>
        <fieldset className="flex flex-wrap items-start gap-3">
          <legend className="mb-1 text-sm font-semibold">Blanks and launcher</legend>
          {blankSelect('Blank', form.blankA, (blankA) => set({ blankA }), false)}
          {blankSelect(
            'Second blank, for the bins',
            form.blankB,
            (blankB) => set({ blankB }),
            true,
          )}
          <LengthField
            label="Gap, coil to blank"
            entry={form.gap}
            error={errors.gap}
            onChange={(gap) => set({ gap })}
          />
          <NumberField
            label="Launch angle"
            suffix="° above horizontal"
            value={form.angleDeg}
            error={errors.angleDeg}
            onChange={(angleDeg) => set({ angleDeg })}
          />
        </fieldset>
        <button
          type="submit"
          disabled={launches.isPending || Object.keys(errors).length > 0 || !blankA}
          className="self-start rounded bg-copper-500 px-4 py-2 font-medium text-white hover:bg-copper-700 disabled:opacity-50"
        >
          {launches.isPending ? 'Simulating…' : 'Fire (simulated)'}
        </button>
        {launches.isPending ? (
          <progress aria-label="Simulating the discharge" className="w-48" />
        ) : null}
      </form>

      {launches.isError ? (
        <ProblemMessage error={launches.error} title="The launch could not be simulated" />
      ) : null}
      {launches.data ? (
        <div className="flex flex-col gap-5" aria-live="polite">
          {launches.data.map((result, i) => (
            <div key={chosen[i]!.id} className="grid gap-4 xl:grid-cols-2">
              <LaunchSummary result={result} name={chosen[i]!.name} />
              <CurrentForceChart result={result} name={chosen[i]!.name} />
            </div>
          ))}
          {launches.data.length === 2 && form.angleDeg < 90 ? (
            <BinPlacement
              a={launches.data[0]!}
              b={launches.data[1]!}
              nameA={chosen[0]!.name}
              nameB={chosen[1]!.name}
            />
          ) : null}
        </div>
      ) : null}
      <p className="text-xs text-ink/70">
        Model: coupled circuits of the bank, the coil and the blank as rings of current (Maxwell
        mutual inductances), integrated until the blank leaves the field; no air drag, magnetic
        layers treated as non-magnetic.
      </p>
      <NominalCaution />
    </section>
  );
}

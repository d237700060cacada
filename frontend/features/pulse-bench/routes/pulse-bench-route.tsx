import { useState } from 'react';
import { capacitanceLabel } from '../../../../shared/units/codes';
import { LengthField, NumberField, WireField } from '../../../components/length-field';
import { BankCaution, bankInSi } from '../../../components/bank-caution';
import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { draftFromBuiltIn, useBuiltInStacks } from '../../../lib/built-in-stacks';
import { useSavedStacks, type StackDraft } from '../../../lib/stack-drafts';
import { useRunLaunches, type LaunchResult } from '../api/run-launch';
import { BinPlacement } from '../components/bin-placement';
import { BuildReport, type SwitchRatings } from '../components/build-report';
import { CoreFields, SwitchFields } from '../components/bench-options';
import { CurrentForceChart } from '../components/launch-charts';
import { LaunchSummary } from '../components/launch-summary';
import {
  bankPresets,
  benchRequest,
  initialBench,
  validateBench,
  type BankPresetId,
  type BenchForm,
} from '../lib/bench-form';
import { HowDoWeKnow } from '../../../components/how-do-we-know';

/** One launch as run: which blank, with or without the core. */
interface Variant {
  blank: StackDraft;
  cored: boolean;
}

/** A's and B's air-core launches, then their cored ones when the core is on: side by side. */
function variantsFor(blanks: StackDraft[], withCore: boolean): Variant[] {
  return blanks.flatMap((blank) =>
    withCore
      ? [
          { blank, cored: false },
          { blank, cored: true },
        ]
      : [{ blank, cored: false }],
  );
}

const variantName = (v: Variant, compared: boolean) =>
  compared ? `${v.blank.name}, ${v.cored ? 'cored coil' : 'air-core coil'}` : v.blank.name;

function switchRatingsOf(f: BenchForm): SwitchRatings | undefined {
  if (!f.checkSwitch) return undefined;
  const amps = f.surgeCurrent.value * (f.surgeCurrent.unit === 'kA' ? 1e3 : 1);
  const i2t = f.i2tRating.value * (f.i2tRating.unit === 'kA2s' ? 1e6 : 1);
  return { surgeCurrentA: amps, i2tA2s: i2t };
}

export function PulseBenchRoute() {
  const builtIns = useBuiltInStacks();
  const [saved] = useSavedStacks();
  const [form, setForm] = useState(initialBench);
  const [ran, setRan] = useState<{ variants: Variant[]; form: BenchForm } | null>(null);
  const launches = useRunLaunches();
  const errors = validateBench(form);
  const set = (patch: Partial<BenchForm>) => setForm({ ...form, ...patch });
  const setBank = (patch: Partial<BenchForm>) => set({ ...patch, bankPreset: 'custom' });

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

  const results =
    launches.data && ran ? ran.variants.map((v, i) => ({ v, r: launches.data[i]! })) : [];
  const compared = ran?.form.withCore ?? false;
  // The bins are placed for the bench as configured: the cored launches when there is a core.
  const forBins = results.filter((x) => x.v.cored === compared);

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
          const variants = variantsFor(chosen, form.withCore);
          setRan({ variants, form });
          launches.mutate(variants.map((v) => benchRequest(form, v.blank, v.cored)));
        }}
      >
        <fieldset className="flex flex-wrap gap-3">
          <legend className="mb-1 text-sm font-semibold">Bank</legend>
          <label className="flex w-full flex-col gap-1 text-sm sm:w-auto">
            <span className="font-medium">Start from</span>
            <select
              className="rounded border border-patina-300 bg-white px-2 py-1"
              value={form.bankPreset}
              onChange={(e) => {
                const id = e.target.value as BankPresetId | 'custom';
                if (id === 'custom') set({ bankPreset: id });
                else set({ bankPreset: id, ...bankPresets[id].fields });
              }}
            >
              {Object.entries(bankPresets).map(([id, p]) => (
                <option key={id} value={id}>
                  {p.label}
                </option>
              ))}
              <option value="custom">Your own figures</option>
            </select>
          </label>
          <LengthField
            label="Capacitance"
            entry={form.capacitance}
            units={['uF', 'F']}
            labelFor={capacitanceLabel}
            error={errors.capacitance}
            onChange={(capacitance) => setBank({ capacitance })}
          />
          <LengthField
            label="Charge voltage"
            entry={form.voltage}
            units={['V', 'kV']}
            error={errors.voltage}
            onChange={(voltage) => setBank({ voltage })}
          />
          <LengthField
            label="Rated voltage"
            entry={form.ratedVoltage}
            units={['V', 'kV']}
            error={errors.ratedVoltage}
            onChange={(ratedVoltage) => setBank({ ratedVoltage })}
          />
          <LengthField
            label="Series resistance"
            entry={form.seriesResistance}
            units={['mohm', 'ohm']}
            error={errors.seriesResistance}
            onChange={(seriesResistance) => setBank({ seriesResistance })}
          />
          <LengthField
            label="Charger output power"
            entry={form.supplyPower}
            units={['W', 'kW']}
            error={errors.supplyPower}
            onChange={(supplyPower) => setBank({ supplyPower })}
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
        <CoreFields form={form} errors={errors} set={set} />
        <SwitchFields form={form} errors={errors} set={set} />
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
      {results.length ? (
        <div className="flex flex-col gap-5" aria-live="polite">
          {chosen.length && compared ? (
            <p className="text-sm">
              Each blank on the air-core coil and on the same coil with the core, side by side.
            </p>
          ) : null}
          {groupByBlank(results).map((group) => (
            <div key={group[0]!.v.blank.id} className="grid gap-4 xl:grid-cols-2">
              {group.map(({ v, r }) => (
                <LaunchColumn
                  key={`${v.blank.id}-${v.cored}`}
                  result={r}
                  name={variantName(v, compared)}
                  switchRatings={switchRatingsOf(ran!.form)}
                  chart={!compared}
                />
              ))}
            </div>
          ))}
          {forBins.length === 2 && ran!.form.angleDeg < 90 ? (
            <BinPlacement
              a={forBins[0]!.r}
              b={forBins[1]!.r}
              nameA={forBins[0]!.v.blank.name}
              nameB={forBins[1]!.v.blank.name}
            />
          ) : null}
        </div>
      ) : null}
      <p className="text-xs text-ink/70">
        Model: coupled circuits of the bank, the coil and the blank as rings of current (Maxwell
        mutual inductances), integrated until the blank leaves the field; a core is a linear
        magnetic body below saturation; no air drag, magnetic layers of the blank treated as
        non-magnetic.
      </p>
      <NominalCaution />
    </section>
  );
}

function groupByBlank<T extends { v: Variant }>(rows: T[]): T[][] {
  const groups = new Map<string, T[]>();
  for (const row of rows) groups.set(row.v.blank.id, [...(groups.get(row.v.blank.id) ?? []), row]);
  return [...groups.values()];
}

function LaunchColumn({
  result,
  name,
  switchRatings,
  chart,
}: {
  result: LaunchResult;
  name: string;
  switchRatings?: SwitchRatings;
  chart: boolean;
}) {
  const figures = (
    <div className="flex flex-col gap-3">
      <LaunchSummary result={result} name={name} />
      <BuildReport result={result} switchRatings={switchRatings} />
    </div>
  );
  // Alone, a launch takes both columns: its figures beside its chart. Compared, each variant
  // takes one column and the figures stand side by side.
  return chart ? (
    <>
      {figures}
      <CurrentForceChart result={result} name={name} />
    </>
  ) : (
    figures
  );
}

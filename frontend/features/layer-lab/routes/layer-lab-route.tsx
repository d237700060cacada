import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { UnitSwitcher } from '../../../components/unit-switcher';
import { draftFromBuiltIn, useBuiltInStacks } from '../../../lib/built-in-stacks';
import { seriesColours } from '../../../lib/chart-format';
import { useMaterials } from '../../../lib/materials';
import {
  decodeDrafts,
  encodeDrafts,
  stackFromDraft,
  useSavedStacks,
  type StackDraft,
} from '../../../lib/stack-drafts';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { ApparentConductivityChart, ImpedancePlaneChart } from '../components/comparison-charts';
import { ComparisonTable } from '../components/comparison-table';
import { SettingsPanel } from '../components/settings-panel';
import { blankDraft, StackEditor } from '../components/stack-editor';
import { defaultSettings, requestFromSettings, validateSettings } from '../settings';
import { useComparison } from '../use-comparison';
import { HowDoWeKnow } from '../../../components/how-do-we-know';

const MAX_BLANKS = 4;

export function LayerLabRoute() {
  const [params, setParams] = useSearchParams();
  const materials = useMaterials();
  const builtIns = useBuiltInStacks();
  const [saved, save] = useSavedStacks();
  const [units] = useUnitPreferences();
  const [settings, setSettings] = useState(defaultSettings);
  const [comparison, run] = useComparison();
  const fromUrl = useMemo(
    () => (params.get('s') ? decodeDrafts(params.get('s')!) : null),
    [params],
  );
  const [drafts, setDrafts] = useState<StackDraft[] | null>(
    fromUrl ?? (saved.length ? saved : null),
  );

  // With nothing shared or saved, start from a plated and a solid demo coin.
  const starters = useMemo(
    () =>
      builtIns.data?.items
        .filter((s) => s.slug === 'estmark-1-mark' || s.slug === 'estmark-5-marks')
        .map(draftFromBuiltIn) ?? null,
    [builtIns.data],
  );

  const update = (next: StackDraft[]) => {
    setDrafts(next);
    save(next);
    setParams({ s: encodeDrafts(next) }, { replace: true });
  };

  const errors = validateSettings(settings);
  const list = drafts ?? starters ?? [];
  const stacks = materials.data
    ? list.map((d) => ({ draft: d, stack: stackFromDraft(d, materials.data) }))
    : [];
  const problems = [
    ...stacks.filter((s) => typeof s.stack === 'string').map((s) => s.stack as string),
    ...(Object.keys(errors).length ? ['check the settings marked below'] : []),
  ];
  const running = comparison.status === 'running';

  const start = () => {
    if (problems.length || !stacks.length) return;
    // What was compared goes into the address, so the page as it stands can be shared.
    setParams({ s: encodeDrafts(list) }, { replace: true });
    run({
      ...requestFromSettings(settings),
      blanks: stacks.map(({ draft, stack }) => ({
        id: draft.id,
        name: draft.name || 'Unnamed blank',
        stack: stack as Exclude<typeof stack, string>,
      })),
    });
  };

  return (
    <section aria-labelledby="lab-title" className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="lab-title" className="text-2xl font-semibold tracking-tight">
            Layer Lab
          </h1>
          <p className="text-sm text-ink/70">
            Build plated, clad and solid blanks and compare what a probe reads from each across
            frequency.
          </p>
          <HowDoWeKnow />
        </div>
        <UnitSwitcher />
      </header>

      {materials.isError ? (
        <ProblemMessage error={materials.error} title="The table could not be loaded" />
      ) : null}

      <div className="flex flex-wrap items-center gap-3">
        <label className="flex min-w-0 max-w-full items-center gap-2 text-sm">
          <span className="shrink-0 font-medium">Add a demo coin</span>
          <select
            className="min-w-0 max-w-full flex-1 rounded border border-patina-300 bg-white px-2 py-1"
            value=""
            disabled={list.length >= MAX_BLANKS}
            onChange={(e) => {
              const s = builtIns.data?.items.find((x) => x.slug === e.target.value);
              if (s) update([...list, { ...draftFromBuiltIn(s), id: `${s.slug}-${list.length}` }]);
            }}
          >
            <option value="">choose…</option>
            {builtIns.data?.items.map((s) => (
              <option key={s.slug} value={s.slug}>
                {s.name} (invented demo coin)
              </option>
            ))}
          </select>
        </label>
        <button
          type="button"
          className="rounded border border-patina-300 px-3 py-1 text-sm hover:bg-patina-50 disabled:opacity-40"
          disabled={list.length >= MAX_BLANKS}
          onClick={() => update([...list, blankDraft(`Blank ${list.length + 1}`)])}
        >
          Add a blank of your own
        </button>
        <span className="text-xs text-ink/60">
          Up to {MAX_BLANKS}. Your blanks stay in this browser and in this page&apos;s address, so a
          link shares them.
        </span>
      </div>

      <div className="grid gap-3 md:grid-cols-2">
        {materials.data
          ? list.map((d, i) => (
              <StackEditor
                key={d.id}
                draft={d}
                colour={seriesColours[i]!}
                materials={materials.data}
                onChange={(next) => update(list.map((x) => (x.id === d.id ? next : x)))}
                onRemove={() => update(list.filter((x) => x.id !== d.id))}
              />
            ))
          : null}
      </div>

      <SettingsPanel settings={settings} errors={errors} onChange={setSettings} />

      <div className="flex flex-wrap items-center gap-4">
        <button
          type="button"
          onClick={start}
          disabled={running || problems.length > 0 || !stacks.length}
          className="rounded bg-copper-500 px-4 py-2 font-medium text-white hover:bg-copper-700 disabled:opacity-50"
        >
          {running ? 'Calculating…' : 'Compare the blanks'}
        </button>
        {running ? (
          <label className="flex items-center gap-2 text-sm">
            <span>Sweeping</span>
            <progress
              className="w-48"
              max={1}
              value={comparison.fraction}
              aria-label="Calculation progress"
            />
            <span className="tabular-nums">{Math.round(comparison.fraction * 100)} %</span>
          </label>
        ) : null}
        {comparison.status === 'done' ? (
          <span className="text-sm text-ink/60">
            computed in {Math.round(comparison.elapsedMs)} ms in this browser
          </span>
        ) : null}
      </div>
      {problems.length ? (
        <ul role="alert" className="list-disc pl-5 text-sm text-copper-700">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
      {comparison.status === 'error' ? (
        <ProblemMessage error={new Error(comparison.message)} title="The comparison failed" />
      ) : null}

      {comparison.status === 'done' ? (
        <div className="flex flex-col gap-4" aria-live="polite">
          <div className="grid gap-4 xl:grid-cols-2">
            <ApparentConductivityChart results={comparison.results} units={units} />
            <ImpedancePlaneChart results={comparison.results} />
          </div>
          <ComparisonTable
            results={comparison.results}
            units={units}
            probeHz={settings.probeKHz * 1e3}
          />
        </div>
      ) : null}
      <p className="text-xs text-ink/70">
        Apparent conductivity is what an instrument calibrated on homogeneous, non-magnetic
        reference blocks would report (Dodd–Deeds model of an air-core probe). A magnetic core reads
        poorly on such a scale: the fit residual says how poorly. A thin plating of a better
        conductor can read above its own bulk conductivity where its skin depth is near its
        thickness (8 µm of copper on zinc reaches about 109 %IACS): the eddy currents, crowded into
        the plating and reflected where it meets the poorer core, put the probe&apos;s impedance off
        the curve of solid plates, nearest a plate better than either layer. Physics, not a fault,
        and not a sign of silver.
      </p>
      <NominalCaution />
    </section>
  );
}

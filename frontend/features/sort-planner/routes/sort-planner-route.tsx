import { useId, useState } from 'react';
import { ConfirmButton } from '../../../components/confirm-button';
import { DataTable } from '../../../components/data-table';
import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { UnitSwitcher } from '../../../components/unit-switcher';
import { fieldProblems, plainMessage } from '../../../lib/field-errors';
import { formatConductivityRange, formatFrequency, formatNumber } from '../../../lib/format';
import { useMaterials } from '../../../lib/materials';
import { useMe } from '../../../lib/session';
import { useSavedStacks } from '../../../lib/stack-drafts';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { useEvaluatePlan, type PlanRequest, type PlanResult } from '../api/evaluate-plan';
import { useReleases } from '../api/list-releases';
import {
  exportUrl,
  getPlan,
  useDeletePlan,
  usePlans,
  useReEvaluate,
  useSavePlan,
  type Comparison,
  type SavedPlan,
} from '../api/saved-plans';
import { PlanSettingsPanel } from '../components/plan-settings';
import { ProductList } from '../components/product-list';
import { ImpedanceRegions, PairChart } from '../components/region-charts';
import { WindowChart } from '../components/window-chart';
import {
  defaultSettings,
  demoCoins,
  fromRequest,
  recyclerMix,
  requestOf,
  settingsProblems,
  type ProductEntry,
} from '../plan-model';

const PRESETS = [
  { label: 'The five Estmark coins', products: demoCoins },
  { label: "Ridgeline's non-ferrous mix", products: recyclerMix },
];

/** Labels of the request's fields, for the service's problems shown beside the settings. */
const FIELD_LABELS: Record<string, string> = {
  'coil.innerRadius': 'Inner radius',
  'coil.outerRadius': 'Outer radius',
  'coil.length': 'Coil length',
  'coil.turns': 'Turns',
  'liftOff.min': 'Smallest lift-off',
  'liftOff.max': 'Largest lift-off',
  'temperature.min': 'Lowest temperature',
  'temperature.max': 'Highest temperature',
  'frequencies.from': 'From',
  'frequencies.to': 'To',
  'frequencies.points': 'Frequencies',
  'method.samples': 'Samples per product',
  'method.seed': 'Seed',
  'tolerances.platingThicknessPercent': 'Plating thickness ±',
};

export function SortPlannerRoute() {
  const me = useMe();
  const role = me.data?.role;
  const canSave = role === 'integrator' || role === 'curator' || role === 'admin';
  const max = canSave ? 12 : 6;
  const materials = useMaterials();
  const [savedStacks] = useSavedStacks();
  const [units] = useUnitPreferences();
  const [products, setProducts] = useState<ProductEntry[]>(demoCoins);
  const [settings, setSettings] = useState(defaultSettings);
  const evaluate = useEvaluatePlan();
  const [shown, setShown] = useState<{
    result: PlanResult;
    request: PlanRequest;
    saved?: SavedPlan;
  } | null>(null);
  const [comparison, setComparison] = useState<Comparison | null>(null);
  const localProblems = settingsProblems(settings);
  const serverProblems: Record<string, string> = {};
  for (const p of fieldProblems(evaluate.error))
    if (FIELD_LABELS[p.field] && !serverProblems[p.field])
      serverProblems[p.field] = plainMessage(p.message, FIELD_LABELS[p.field]!);
  const errors = { ...serverProblems, ...localProblems };

  const run = () => {
    if (Object.keys(localProblems).length || !products.length) return;
    const request = requestOf(products, settings);
    setComparison(null);
    evaluate.mutate(request, { onSuccess: (result) => setShown({ result, request }) });
  };

  return (
    <section aria-labelledby="planner-title" className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="planner-title" className="text-2xl font-semibold tracking-tight">
            Sort Planner
          </h1>
          <p className="text-sm text-ink/70">
            The window of readings each product gives at each frequency, where windows overlap, and
            the frequency that keeps them apart.
          </p>
        </div>
        <UnitSwitcher />
      </header>

      <ProductList
        products={products}
        onChange={setProducts}
        presets={PRESETS}
        materials={materials.data}
        savedStacks={savedStacks}
        max={max}
      />
      <PlanSettingsPanel
        settings={settings}
        errors={errors}
        onChange={setSettings}
        largeAllowed={canSave}
      />

      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="rounded bg-patina-700 px-4 py-2 text-sm font-semibold text-white hover:bg-patina-800 disabled:opacity-50"
          disabled={evaluate.isPending || !products.length}
          onClick={run}
        >
          Evaluate the plan
        </button>
        {evaluate.isPending ? (
          <span className="flex items-center gap-2 text-sm">
            <progress aria-label="Computing the plan" className="h-2 w-40" />
            Computing {products.length} products × {settings.points} frequencies…
          </span>
        ) : null}
        {Object.keys(localProblems).length ? (
          <span className="text-sm text-copper-700">Check the settings marked above.</span>
        ) : null}
      </div>

      {evaluate.isError ? (
        <ProblemMessage
          error={evaluate.error}
          title="The plan could not be evaluated"
          fields={FIELD_LABELS_MAP}
        />
      ) : null}

      {canSave ? (
        <SavedPlans
          current={shown}
          onLoad={(plan) => {
            const restored = fromRequest(plan.inputs as unknown as PlanRequest);
            setProducts(restored.products);
            setSettings(restored.settings);
            setComparison(null);
            setShown({
              result: plan.result,
              request: plan.inputs as unknown as PlanRequest,
              saved: plan,
            });
          }}
          onSaved={(plan) => setShown((s) => (s ? { ...s, saved: plan } : s))}
          onCompared={setComparison}
        />
      ) : (
        <p className="text-sm text-ink/70">
          Sign in with an integrator, curator or admin account to save plans, compare them with a
          newer release of the table and export them for firmware.
        </p>
      )}

      {comparison ? <ComparisonNote comparison={comparison} unit={units.conductivity} /> : null}
      {shown ? <PlanResults result={shown.result} /> : null}
      <NominalCaution />
    </section>
  );
}

const FIELD_LABELS_MAP = Object.fromEntries(
  Object.entries(FIELD_LABELS).map(([k, label]) => [k, { label }]),
);

function PlanResults({ result }: { result: PlanResult }) {
  const [units] = useUnitPreferences();
  const unit = units.conductivity;
  const recommendedIndex = Math.max(
    0,
    result.frequencies.findIndex((f) => f.frequencyHz === result.recommendedFrequencyHz),
  );
  const [chosen, setChosen] = useState<number | null>(null);
  const planeIndex = chosen ?? recommendedIndex;
  const selectId = useId();
  const at = result.frequencies[recommendedIndex];
  return (
    <section aria-labelledby="results-title" className="flex flex-col gap-4">
      <h2 id="results-title" className="text-lg font-semibold">
        Result
      </h2>
      <div className="rounded-md border border-patina-100 bg-white p-4 text-sm">
        <p>
          Recommended frequency:{' '}
          <strong data-testid="recommended-frequency">
            {result.recommendedFrequencyHz
              ? formatFrequency(result.recommendedFrequencyHz)
              : 'none (one product)'}
          </strong>
          {at && at.separability !== null ? (
            <>
              {' '}
              (separability {formatNumber(at.separability)}:{' '}
              {at.separability > 0
                ? 'every window stands apart, the closest two by that many window widths'
                : 'some windows still overlap'}
              )
            </>
          ) : null}
        </p>
        {result.recommendedPair ? (
          <p>
            Recommended pair: {formatFrequency(result.recommendedPair[0]!)} and{' '}
            {formatFrequency(result.recommendedPair[1]!)}
          </p>
        ) : null}
        <p className="text-xs text-ink/60">
          Table release {result.release.version}, checksum {result.release.checksum.slice(0, 16)}…
        </p>
        {result.warnings.length ? (
          <ul className="mt-2 list-disc pl-5 text-xs" aria-label="Warnings">
            {result.warnings.map((w, i) => (
              <li key={`${w.code}-${i}`}>{w.message}</li>
            ))}
          </ul>
        ) : null}
      </div>
      <WindowChart result={result} units={units} />
      {at ? (
        <DataTable
          caption={`Windows at the recommended ${formatFrequency(at.frequencyHz)}`}
          headers={['Product', `Window at ${formatFrequency(at.frequencyHz)}`, 'Overlaps with']}
        >
          {at.windows.map((w) => (
            <tr key={w.product} className="border-t border-patina-100">
              <td className="px-3 py-2 font-medium">{w.product}</td>
              <td className="px-3 py-2 tabular-nums">
                {formatConductivityRange(w.lowSPerM, w.highSPerM, unit)}
              </td>
              <td className="px-3 py-2">
                {at.overlaps
                  .filter((o) => o.a === w.product || o.b === w.product)
                  .map(
                    (o) =>
                      `${o.a === w.product ? o.b : o.a} (${formatNumber(o.fraction * 100, 2)} %)`,
                  )
                  .join(', ') || 'none'}
              </td>
            </tr>
          ))}
        </DataTable>
      ) : null}
      <div className="flex flex-col gap-1 text-sm">
        <label htmlFor={selectId} className="font-medium">
          Frequency of the impedance plane
        </label>
        <select
          id={selectId}
          className="max-w-48 rounded border border-patina-300 bg-white px-2 py-1"
          value={planeIndex}
          onChange={(e) => setChosen(Number(e.target.value))}
        >
          {result.frequencies.map((f, i) => (
            <option key={f.frequencyHz} value={i}>
              {formatFrequency(f.frequencyHz)}
            </option>
          ))}
        </select>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <ImpedanceRegions result={result} frequencyIndex={planeIndex} />
        <PairChart result={result} units={units} />
      </div>
    </section>
  );
}

function ComparisonNote({ comparison, unit }: { comparison: Comparison; unit: string }) {
  const r = comparison.recommendedFrequencyHz;
  return (
    <div role="status" className="rounded-md border border-patina-300 bg-patina-50 p-4 text-sm">
      <p className="font-semibold">
        Release {comparison.from.version} → {comparison.to.version}:{' '}
        {comparison.moved.length
          ? `${comparison.moved.length} window${comparison.moved.length === 1 ? '' : 's'} moved`
          : 'no window moved'}
        ; recommended {r.from ? formatFrequency(r.from) : '—'} →{' '}
        {r.to ? formatFrequency(r.to) : '—'}.
      </p>
      {comparison.moved.length ? (
        <ul className="mt-1 list-disc pl-5">
          {comparison.moved.slice(0, 12).map((m) => (
            <li key={`${m.frequencyHz}-${m.product}`}>
              {m.product} at {formatFrequency(m.frequencyHz)}:{' '}
              {formatConductivityRange(m.from.lowSPerM, m.from.highSPerM, unit)} →{' '}
              {formatConductivityRange(m.to.lowSPerM, m.to.highSPerM, unit)}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="text-xs text-ink/60">
        Shown below: the plan against {comparison.to.version}. Save it to keep it.
      </p>
    </div>
  );
}

function SavedPlans({
  current,
  onLoad,
  onSaved,
  onCompared,
}: {
  current: { result: PlanResult; request: PlanRequest; saved?: SavedPlan } | null;
  onLoad: (plan: SavedPlan) => void;
  onSaved: (plan: SavedPlan) => void;
  onCompared: (c: Comparison) => void;
}) {
  const plans = usePlans(true);
  const releases = useReleases();
  const save = useSavePlan();
  const remove = useDeletePlan();
  const reEvaluate = useReEvaluate();
  const [name, setName] = useState('My sort plan');
  const [release, setRelease] = useState('');
  const nameId = useId();
  const releaseId = useId();
  const saved = current?.saved;
  return (
    <section
      aria-labelledby="saved-title"
      className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4"
    >
      <h2 id="saved-title" className="text-sm font-semibold">
        Saved plans and exports
      </h2>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1 text-sm">
          <label htmlFor={nameId} className="font-medium">
            Plan name
          </label>
          <input
            id={nameId}
            className="rounded border border-patina-300 bg-white px-2 py-1"
            value={name}
            maxLength={80}
            onChange={(e) => setName(e.target.value)}
          />
        </div>
        <button
          type="button"
          className="rounded border border-patina-300 px-3 py-1 text-sm hover:bg-patina-50 disabled:opacity-40"
          disabled={!current || save.isPending || !name.trim()}
          onClick={() =>
            current &&
            save.mutate({ name: name.trim(), plan: current.request }, { onSuccess: onSaved })
          }
        >
          {save.isPending ? 'Saving…' : 'Save this plan'}
        </button>
      </div>
      {save.isError ? <ProblemMessage error={save.error} title="The plan was not saved" /> : null}
      {saved ? (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span>
            Saved as “{saved.name}” (release {saved.release.version}). Export:
          </span>
          <a
            className="rounded border border-patina-300 px-2 py-1 hover:bg-patina-50"
            href={exportUrl(saved.id, 'c')}
            download
          >
            C header
          </a>
          <a
            className="rounded border border-patina-300 px-2 py-1 hover:bg-patina-50"
            href={exportUrl(saved.id, 'csv')}
            download
          >
            CSV
          </a>
          <a
            className="rounded border border-patina-300 px-2 py-1 hover:bg-patina-50"
            href={exportUrl(saved.id, 'json')}
            download
          >
            JSON
          </a>
          <label htmlFor={releaseId} className="ml-2">
            Re-evaluate against
          </label>
          <select
            id={releaseId}
            className="rounded border border-patina-300 bg-white px-2 py-1"
            value={release}
            onChange={(e) => setRelease(e.target.value)}
          >
            <option value="">the newest release</option>
            {releases.data?.items.map((r) => (
              <option key={r.version} value={r.version}>
                {r.version}
              </option>
            ))}
          </select>
          <button
            type="button"
            className="rounded border border-patina-300 px-2 py-1 hover:bg-patina-50 disabled:opacity-40"
            disabled={reEvaluate.isPending}
            onClick={() =>
              reEvaluate.mutate(
                { id: saved.id, release: release || undefined },
                { onSuccess: onCompared },
              )
            }
          >
            Re-evaluate
          </button>
        </div>
      ) : null}
      {reEvaluate.isError ? (
        <ProblemMessage error={reEvaluate.error} title="The plan could not be re-evaluated" />
      ) : null}
      {plans.data?.items.length ? (
        <DataTable
          caption="Your saved plans"
          headers={['Name', 'Release', 'Saved', { label: 'Actions', visuallyHidden: true }]}
          minWidth="32rem"
        >
          {plans.data.items.map((p) => (
            <tr key={p.id} className="border-t border-patina-100">
              <td className="px-3 py-2">{p.name}</td>
              <td className="px-3 py-2">{p.release.version}</td>
              <td className="px-3 py-2">{p.createdAt.slice(0, 10)}</td>
              <td className="flex flex-wrap gap-2 px-3 py-2">
                <button
                  type="button"
                  className="rounded border border-patina-300 px-2 py-0.5 text-xs hover:bg-patina-50"
                  onClick={async () => onLoad(await getPlan(p.id))}
                >
                  Load <span className="sr-only">{p.name}</span>
                </button>
                <ConfirmButton
                  className="rounded border border-copper-500 px-2 py-0.5 text-xs text-copper-700 hover:bg-copper-100"
                  title={`Delete the plan “${p.name}”?`}
                  description="The plan and its result go for good; exports already downloaded keep working."
                  confirmLabel="Delete the plan"
                  onConfirm={() => remove.mutate(p.id)}
                >
                  Delete <span className="sr-only">{p.name}</span>
                </ConfirmButton>
              </td>
            </tr>
          ))}
        </DataTable>
      ) : null}
    </section>
  );
}

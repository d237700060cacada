import { useState } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { ProblemMessage } from '../../../components/problem-message';
import { signInPath, useMe } from '../../../lib/session';
import { useSortPlans } from '../api/list-sort-plans';
import { useRunBatch, type BatchProgress } from '../api/run-batch';
import { BatchResults } from './batch-results';

/** Roles that may send a batch (x-roles of POST /match/batch in openapi.yaml). */
const BATCH_ROLES = ['integrator', 'curator', 'admin'];

const TEMPLATE = '/api/v1/match/batch/template';

function Progress({ progress }: { progress: BatchProgress }) {
  const matching = progress.rows !== null;
  return (
    <div className="flex flex-col gap-2 text-sm" aria-live="polite">
      <div className="flex flex-wrap items-center gap-2">
        <span className="w-24">Upload</span>
        <progress aria-label="Upload" max={1} value={progress.uploaded} className="w-48" />
        <span className="tabular-nums">{Math.round(progress.uploaded * 100)} %</span>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <span className="w-24">Matching</span>
        {matching ? (
          <progress
            aria-label="Matching"
            max={progress.rows!}
            value={progress.received}
            className="w-48"
          />
        ) : (
          <progress aria-label="Matching" className="w-48" />
        )}
        <span className="tabular-nums">
          {matching
            ? `${progress.received.toLocaleString('en-US')} of ${progress.rows!.toLocaleString('en-US')} readings`
            : progress.uploaded < 1
              ? 'after the upload'
              : 'reading the file…'}
        </span>
      </div>
    </div>
  );
}

/**
 * "Many readings": a CSV file in, the three best candidates of each reading out, with the
 * upload's and the matching's progress, the bad rows by row number and a CSV download.
 */
export function BatchPanel() {
  const me = useMe();
  const location = useLocation();
  const [file, setFile] = useState<File | null>(null);
  const [progress, setProgress] = useState<BatchProgress | null>(null);
  const batch = useRunBatch(setProgress);
  const role = me.data?.role;
  const allowed = role !== undefined && BATCH_ROLES.includes(role);
  const plans = useSortPlans(allowed);
  /** The saved plan's id as the select holds it; '' ranks the table. */
  const [planId, setPlanId] = useState('');
  const plan = plans.data?.items.find((p) => String(p.id) === planId) ?? null;

  return (
    <section
      aria-labelledby="batch-title"
      className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4"
    >
      <h2 id="batch-title" className="text-lg font-semibold">
        Many readings
      </h2>
      <p className="text-sm">
        A CSV file of readings, up to 100,000 rows and 20 MiB: each gets its three best candidates,
        scored as above. Columns: id, conductivity or resistivity with its unit, temperature, and
        optionally density and frequency; the{' '}
        <a className="text-patina-700 underline" href={TEMPLATE} download>
          template (CSV)
        </a>{' '}
        shows them with a few of the demo recycler&apos;s invented readings.
      </p>
      {me.isPending ? null : !allowed ? (
        <p className="rounded-md border border-dashed border-patina-300 p-4 text-sm">
          {role ? (
            <>
              Matching many readings at once is for integrators, curators and administrators; your
              role is {role}.
            </>
          ) : (
            <>
              Matching many readings at once is for integrators, curators and administrators:{' '}
              <Link
                className="text-patina-700 underline"
                to={signInPath(`${location.pathname}${location.search}`)}
              >
                sign in
              </Link>{' '}
              with such an account.
            </>
          )}
        </p>
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (!file || batch.isPending) return;
            setProgress({ uploaded: 0, rows: null, received: 0 });
            batch.mutate(
              { file, plan: plan && { id: plan.id, name: plan.name } },
              { onSettled: () => setProgress(null) },
            );
          }}
        >
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium">Sort by a saved plan (optional)</span>
            <select
              className="max-w-full rounded border border-patina-300 px-2 py-1.5 sm:max-w-md"
              value={planId}
              onChange={(e) => (setPlanId(e.target.value), batch.reset())}
            >
              <option value="">No plan: the three best alloys of the table</option>
              {plans.data?.items.map((p) => (
                <option key={p.id} value={String(p.id)}>
                  {p.name} (table {p.release.version})
                </option>
              ))}
            </select>
            <span className="text-ink/70">
              {plans.data && plans.data.items.length === 0 ? (
                <>
                  You have no saved plans yet: save one in the{' '}
                  <Link className="text-patina-700 underline" to="/sort-planner">
                    Sort Planner
                  </Link>
                  .
                </>
              ) : (
                "With a plan, each reading gets the plan's product whose window holds it, at the plan's frequency nearest the reading's own (or its recommended one): a product, none or ambiguous."
              )}
            </span>
          </label>
          <label className="flex flex-col gap-1 text-sm">
            <span className="font-medium">CSV file of readings</span>
            <input
              type="file"
              accept=".csv,text/csv"
              className="max-w-full"
              onChange={(e) => (setFile(e.target.files?.[0] ?? null), batch.reset())}
            />
          </label>
          <div>
            <button
              type="submit"
              className="rounded bg-copper-500 px-3 py-1.5 text-white disabled:opacity-40"
              disabled={!file || batch.isPending}
            >
              {plan ? 'Sort the file' : 'Match the file'}
            </button>
          </div>
          {progress ? <Progress progress={progress} /> : null}
        </form>
      )}
      {batch.isError ? (
        <ProblemMessage error={batch.error} title="The file was not matched" />
      ) : null}
      {batch.data ? <BatchResults answer={batch.data} /> : null}
    </section>
  );
}

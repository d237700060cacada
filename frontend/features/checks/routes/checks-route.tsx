import { ProblemMessage } from '../../../components/problem-message';
import { useChecks } from '../api/get-checks';
import { CoverageTable } from '../components/coverage-table';
import { EngineTable } from '../components/engine-table';

/** How we know: the engine against figures from outside it, and how much of the table is cited. */
export function ChecksRoute() {
  const checks = useChecks();
  const engine = checks.data?.engine ?? [];
  const passed = engine.filter((c) => c.pass).length;
  return (
    <section aria-labelledby="checks-title" className="flex flex-col gap-5">
      <header>
        <h1 id="checks-title" className="text-2xl font-semibold tracking-tight">
          Checks
        </h1>
        <p className="max-w-3xl text-sm text-ink/70">
          The calculators are only as good as the physics behind them, so this server works a set of
          problems whose answers were published or computed independently, and sets its own answer
          beside each one. A check passes when the two agree within the stated tolerance. Further
          down: how many of the reference table&apos;s values come from a document someone has read,
          and how many are still recalled from memory.
        </p>
      </header>

      {checks.isPending ? (
        <p role="status" className="rounded-md border border-patina-100 bg-white p-4 text-sm">
          Running the engine checks on the server…
        </p>
      ) : checks.isError ? (
        <div className="flex flex-col gap-2">
          <ProblemMessage error={checks.error} title="The checks could not be loaded" />
          <p>
            <button
              type="button"
              className="rounded bg-copper-500 px-4 py-2 text-sm text-white hover:bg-copper-700"
              onClick={() => void checks.refetch()}
            >
              Try again
            </button>
          </p>
        </div>
      ) : (
        <>
          <section aria-labelledby="engine-title" className="flex flex-col gap-2">
            <h2 id="engine-title" className="text-lg font-semibold">
              The engine against its references
            </h2>
            <p className="text-sm text-ink/70">
              {passed} of {engine.length} checks pass. Difference is |ours − reference| divided by
              the reference.
            </p>
            <EngineTable checks={engine} />
          </section>
          <section aria-labelledby="coverage-title" className="flex flex-col gap-2">
            <h2 id="coverage-title" className="text-lg font-semibold">
              Where the table&apos;s values come from
            </h2>
            <CoverageTable table={checks.data.table} />
          </section>
        </>
      )}
    </section>
  );
}

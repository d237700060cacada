import { ProblemMessage } from '../../../components/problem-message';
import { UnitSwitcher } from '../../../components/unit-switcher';
import { useMe } from '../../../lib/session';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import { usePending, useReleases, useReviewMutations } from '../api/review';
import { ImportPanel } from '../components/import-panel';
import { RevisionCard } from '../components/revision-card';

/** Curators' and admins' desk; the router's RequireRole guard keeps everyone else out. */
export function ReviewDeskRoute() {
  const me = useMe();
  const pending = usePending();
  const releases = useReleases();
  const { review, publish } = useReviewMutations();
  const [units] = useUnitPreferences();
  return (
    <section aria-labelledby="desk-title" className="flex flex-col gap-5">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="desk-title" className="text-2xl font-semibold tracking-tight">
            Review Desk
          </h1>
          <p className="text-sm text-ink/70">
            Every change needs a source and a second curator. Approval applies it at once, with its
            history.
          </p>
        </div>
        <UnitSwitcher />
      </header>
      <section aria-labelledby="queue-title" className="flex flex-col gap-3">
        <h2 id="queue-title" className="text-lg font-semibold">
          Waiting for review ({pending.data?.items.length ?? 0})
        </h2>
        {pending.isError ? <ProblemMessage error={pending.error} /> : null}
        {review.isError ? <ProblemMessage error={review.error} title="Not reviewed" /> : null}
        {pending.data?.items.length === 0 ? (
          <p className="text-sm text-ink/70">Nothing waits for review.</p>
        ) : null}
        <ol aria-label="Proposals waiting for review" className="flex flex-col gap-3">
          {pending.data?.items.map((r) => (
            <RevisionCard
              key={r.id}
              revision={r}
              mine={r.author === me.data?.email}
              pending={review.isPending}
              units={units}
              onDecide={(decision, comment) => review.mutate({ id: r.id, decision, comment })}
            />
          ))}
        </ol>
      </section>
      <ImportPanel onSubmitted={() => void pending.refetch()} />
      <section
        aria-labelledby="releases-title"
        className="flex flex-col gap-2 rounded-md border border-patina-100 bg-white p-4"
      >
        <h2 id="releases-title" className="text-lg font-semibold">
          Releases
        </h2>
        <p className="text-sm">
          A release freezes the published table under a version and a SHA-256 checksum; tools can
          read it with ?release=.
        </p>
        <button
          type="button"
          className="self-start rounded bg-patina-700 px-3 py-1.5 text-white"
          disabled={publish.isPending}
          onClick={() => publish.mutate()}
        >
          Publish a release of the current table
        </button>
        {publish.isError ? <ProblemMessage error={publish.error} /> : null}
        <ul className="text-sm">
          {releases.data?.items.map((r) => (
            <li key={r.version} className="font-mono text-xs">
              {r.version} · {new Date(r.createdAt).toLocaleString()} · {r.changes} change(s) ·
              sha256 {r.checksum.slice(0, 16)}…
            </li>
          ))}
        </ul>
      </section>
    </section>
  );
}

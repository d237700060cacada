import { NominalCaution } from '../../../components/nominal-caution';
import { ProblemMessage } from '../../../components/problem-message';
import { useReadings } from '../api/list-readings';
import { useRunMatch } from '../api/run-match';
import { BatchPanel } from '../components/batch-panel';
import { CandidateList } from '../components/candidate-list';
import { MatchForm } from '../components/match-form';
import { MatchPlot } from '../components/match-plot';
import { HowDoWeKnow } from '../../../components/how-do-we-know';

export function MatchRoute() {
  const readings = useReadings();
  const match = useRunMatch();
  return (
    <section aria-labelledby="match-title" className="flex flex-col gap-5">
      <header>
        <h1 id="match-title" className="text-2xl font-semibold tracking-tight">
          Match
        </h1>
        <p className="text-sm text-ink/70">
          A reading in, the alloys that could give it out. Each reading is corrected to the
          table&apos;s 20 °C with each alloy&apos;s own temperature coefficient.
        </p>
        <HowDoWeKnow />
      </header>
      <div className="grid gap-5 lg:grid-cols-[24rem_1fr]">
        <MatchForm
          readings={readings.data?.items ?? []}
          pending={match.isPending}
          onSubmit={(r) => match.mutate(r)}
        />
        <div aria-live="polite" className="flex flex-col gap-3">
          {match.isError ? (
            <ProblemMessage error={match.error} title="The reading could not be matched" />
          ) : null}
          {match.data ? (
            <>
              <h2 className="text-lg font-semibold">Candidates</h2>
              <p className="text-sm text-ink/80">
                The fit says how well the reading, and its density when you give one, falls inside
                each alloy&apos;s handbook range within the reading&apos;s uncertainty: 1.00 inside
                both ranges near the nominal, lower the further outside. It ranks; it is not a
                probability.
              </p>
              <MatchPlot result={match.data} />
              <CandidateList result={match.data} />
            </>
          ) : !match.isError ? (
            <p className="rounded-md border border-dashed border-patina-300 p-6 text-sm text-ink/70">
              Enter a reading and press <kbd className="rounded border px-1">Enter</kbd> to rank the
              candidates.
            </p>
          ) : null}
        </div>
      </div>
      <BatchPanel />
      <NominalCaution />
    </section>
  );
}

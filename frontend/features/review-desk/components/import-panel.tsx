import { useState } from 'react';
import { ProblemMessage } from '../../../components/problem-message';
import { useMaterials } from '../../../lib/materials';
import { uploadImport, type ImportAnswer } from '../api/review';

/** Upload a CSV or JSON file: a dry run first, then, if every row is clean, a revision to review. */
export function ImportPanel({ onSubmitted }: { onSubmitted: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [citation, setCitation] = useState('');
  const [sourceKind, setSourceKind] = useState('measurement_set');
  const [progress, setProgress] = useState<number | null>(null);
  const [answer, setAnswer] = useState<ImportAnswer | null>(null);
  const [error, setError] = useState<unknown>(null);
  const materials = useMaterials();

  const send = async (apply: boolean) => {
    if (!file) return;
    const form = new FormData();
    form.append('file', file);
    if (apply) {
      form.append('apply', 'true');
      form.append('citation', citation);
      form.append('sourceKind', sourceKind);
    }
    setError(null);
    setProgress(0);
    try {
      const result = await uploadImport(form, setProgress);
      setAnswer(result);
      if (!result.dryRun) onSubmitted();
    } catch (e) {
      setAnswer(null);
      setError(e);
    } finally {
      setProgress(null);
    }
  };

  return (
    <section
      aria-labelledby="import-title"
      className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4"
    >
      <h2 id="import-title" className="text-lg font-semibold">
        Import a file
      </h2>
      <p className="text-sm">
        Templates:{' '}
        <a className="text-patina-700 underline" href="/api/v1/imports/template?kind=alloys">
          alloys
        </a>
        ,{' '}
        <a className="text-patina-700 underline" href="/api/v1/imports/template?kind=measurements">
          measurement set
        </a>
        . Every row is checked; a file with any bad row imports nothing.
      </p>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">CSV or JSON file</span>
        <input
          type="file"
          accept=".csv,.json,text/csv,application/json"
          onChange={(e) => (setFile(e.target.files?.[0] ?? null), setAnswer(null), setError(null))}
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="rounded border border-patina-300 px-3 py-1.5 disabled:opacity-40"
          disabled={!file || progress !== null}
          onClick={() => void send(false)}
        >
          Check the file
        </button>
      </div>
      {progress !== null ? (
        <progress aria-label="Upload progress" max={1} value={progress} className="w-48" />
      ) : null}
      {error ? <ProblemMessage error={error} title="The file was refused" /> : null}
      {answer ? (
        <div role="status" className="flex flex-col gap-2 text-sm">
          <p className="font-medium">
            {answer.dryRun
              ? `All ${answer.rows} rows are clean. Nothing is changed yet.`
              : `Submitted for review as revision ${answer.revision?.id}.`}
          </p>
          <ul className="list-disc pl-5">
            {answer.changes.slice(0, 20).map((c) => (
              <li key={c.row}>
                row {c.row}: {c.action} {materials.data?.get(c.alloy)?.name ?? c.alloy} ({c.summary}
                , as in the file)
              </li>
            ))}
            {answer.changes.length > 20 ? <li>… and {answer.changes.length - 20} more</li> : null}
          </ul>
          {answer.dryRun ? (
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-1 flex-col gap-1">
                <span className="font-medium">Source: citation (required)</span>
                <input
                  className="rounded border border-patina-300 px-2 py-1"
                  value={citation}
                  onChange={(e) => setCitation(e.target.value)}
                />
              </label>
              <select
                aria-label="Kind of source"
                className="rounded border border-patina-300 px-2 py-1"
                value={sourceKind}
                onChange={(e) => setSourceKind(e.target.value)}
              >
                <option value="measurement_set">measurement set</option>
                <option value="handbook">handbook</option>
                <option value="standard">standard</option>
                <option value="paper">paper</option>
              </select>
              <button
                type="button"
                className="rounded bg-copper-500 px-3 py-1.5 text-white"
                disabled={!citation.trim()}
                onClick={() => void send(true)}
              >
                Submit for review
              </button>
            </div>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}

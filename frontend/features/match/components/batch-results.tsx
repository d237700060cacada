import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  batchCsvHeader,
  batchCsvRecord,
  batchPlanCsvHeader,
  batchPlanCsvRecord,
  type BatchCandidate,
  type BatchLine,
  type BatchPlanClassified,
  type BatchPlanLine,
} from '../../../../shared/match/batch-results';
import { DataTable } from '../../../components/data-table';
import { UnitSwitcher } from '../../../components/unit-switcher';
import {
  conductivityQuantityName,
  formatConductivity,
  formatDensity,
  formatFrequency,
  formatNumber,
} from '../../../lib/format';
import { useUnitPreferences } from '../../../lib/unit-preferences';
import type { BatchAnswer } from '../api/run-batch';

const PAGE_SIZE = 25;
/** A bad row's line: the key "status" with the value "error" (a string value cannot hold it unescaped). */
const isErrorLine = (line: string) => line.includes('"status":"error"');

/** The answer as the CSV the API gives for Accept: text/csv, built from the NDJSON received. */
function resultsCsv(answer: BatchAnswer): Blob {
  const parts = [answer.plan ? batchPlanCsvHeader() : batchCsvHeader()];
  for (const line of answer.lines)
    parts.push(
      answer.plan
        ? batchPlanCsvRecord(JSON.parse(line) as BatchPlanLine)
        : batchCsvRecord(JSON.parse(line) as BatchLine),
    );
  return new Blob(parts, { type: 'text/csv;charset=utf-8' });
}

function download(answer: BatchAnswer) {
  const url = URL.createObjectURL(resultsCsv(answer));
  const a = document.createElement('a');
  a.href = url;
  a.download = `${answer.fileName.replace(/\.[^.]*$/, '') || 'readings'}-${answer.plan ? 'sorted' : 'matched'}.csv`;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

function Candidate({ c }: { c: BatchCandidate | undefined }) {
  if (!c) return <span className="text-ink/50">—</span>;
  return (
    <span>
      <Link to={`/alloys/${c.slug}`} className="text-patina-700 hover:underline">
        {c.name}
      </Link>{' '}
      <span className="text-ink/70 tabular-nums">fit {formatNumber(c.score, 2)}</span>
    </span>
  );
}

/** How a plan sorted a reading, in words for the table. */
function Sorted({ l }: { l: BatchPlanClassified }) {
  if (l.status === 'product') return <span className="font-medium">{l.product}</span>;
  if (l.status === 'none') return <span className="text-ink/70">none: no window holds it</span>;
  return <span>ambiguous: {l.products.join(', ')}</span>;
}

/** The matched readings a page at a time, the bad rows by row number, and the download. */
export function BatchResults({ answer }: { answer: BatchAnswer }) {
  const [units] = useUnitPreferences();
  const [onlyBad, setOnlyBad] = useState(false);
  const [page, setPage] = useState(0);
  const badIndices = useMemo(
    () => answer.lines.flatMap((l, i) => (isErrorLine(l) ? [i] : [])),
    [answer.lines],
  );
  const shown = onlyBad ? badIndices.length : answer.lines.length;
  const pages = Math.max(1, Math.ceil(shown / PAGE_SIZE));
  const current = Math.min(page, pages - 1);
  const slice = useMemo(() => {
    const from = current * PAGE_SIZE;
    const indices = onlyBad
      ? badIndices.slice(from, from + PAGE_SIZE)
      : Array.from({ length: Math.min(PAGE_SIZE, answer.lines.length - from) }, (_, k) => from + k);
    return indices.map((i) => JSON.parse(answer.lines[i]!) as BatchLine | BatchPlanLine);
  }, [answer.lines, badIndices, onlyBad, current]);
  const none = answer.lines.filter((l) => l.includes('"status":"none"')).length;
  const ambiguous = answer.plan
    ? answer.lines.filter((l) => l.includes('"status":"ambiguous"')).length
    : 0;
  const quantity = conductivityQuantityName(units.conductivity);
  const firstBad = badIndices
    .slice(0, 10)
    .map((i) => JSON.parse(answer.lines[i]!) as Extract<BatchLine, { status: 'error' }>);

  return (
    <div className="flex flex-col gap-3">
      <div role="status" className="flex flex-col gap-1 rounded-md bg-patina-50 p-3 text-sm">
        <p className="font-medium">
          {answer.rows.toLocaleString('en-US')} readings from {answer.fileName}
          {answer.plan ? (
            <>
              {' '}
              sorted by the plan {answer.plan.name} (table {answer.plan.release.version}):{' '}
              {(answer.rows - answer.errors - none - ambiguous).toLocaleString('en-US')} to a
              product, {none.toLocaleString('en-US')} to none, {ambiguous.toLocaleString('en-US')}{' '}
              ambiguous,{' '}
            </>
          ) : (
            <>
              : {(answer.rows - answer.errors - none).toLocaleString('en-US')} with candidates,{' '}
              {none.toLocaleString('en-US')} with none,{' '}
            </>
          )}
          {answer.errors.toLocaleString('en-US')} bad {answer.errors === 1 ? 'row' : 'rows'}.
        </p>
        {firstBad.length ? (
          <ul aria-label="Bad rows" className="list-disc pl-5">
            {firstBad.map((l) => (
              <li key={l.row}>
                Row {l.row}
                {l.id ? ` (${l.id})` : ''}: {l.error}
              </li>
            ))}
            {badIndices.length > firstBad.length ? (
              <li>… and {badIndices.length - firstBad.length} more (show bad rows only below)</li>
            ) : null}
          </ul>
        ) : null}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="rounded bg-copper-500 px-3 py-1.5 text-white"
          onClick={() => download(answer)}
        >
          Download the results (CSV)
        </button>
        <label className="flex items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={onlyBad}
            onChange={(e) => (setOnlyBad(e.target.checked), setPage(0))}
          />
          Bad rows only
        </label>
        <UnitSwitcher />
      </div>
      <DataTable
        caption={`Batch results, page ${current + 1} of ${pages}`}
        headers={
          answer.plan
            ? ['Row', 'Id', quantity, 'Temperature', 'Frequency used', 'Sorted as', 'Notes']
            : ['Row', 'Id', quantity, 'Temperature', 'Density', 'Best', 'Second', 'Third']
        }
        minWidth={answer.plan ? '48rem' : '56rem'}
      >
        {slice.map((l) =>
          l.status === 'error' ? (
            <tr key={l.row} className="border-t border-patina-100 bg-red-50">
              <td className="px-3 py-2 tabular-nums">{l.row}</td>
              <td className="px-3 py-2">{l.id ?? '—'}</td>
              <td colSpan={answer.plan ? 5 : 6} className="px-3 py-2">
                Bad row: {l.error}
              </td>
            </tr>
          ) : 'planFrequencyHz' in l ? (
            <tr key={l.row} className="border-t border-patina-100">
              <td className="px-3 py-2 tabular-nums">{l.row}</td>
              <td className="px-3 py-2">{l.id ?? '—'}</td>
              <td className="px-3 py-2 tabular-nums">
                {formatConductivity(l.reading.conductivitySPerM, units.conductivity)}
              </td>
              <td className="px-3 py-2 tabular-nums">
                {formatNumber(l.reading.temperatureK - 273.15)} °C
              </td>
              <td className="px-3 py-2 tabular-nums">
                {formatFrequency(l.planFrequencyHz)}{' '}
                <span className="text-ink/70">
                  {l.frequencyFrom === 'reading'
                    ? '(nearest the reading’s)'
                    : l.frequencyFrom === 'recommended'
                      ? '(recommended; the reading has none)'
                      : '(the plan’s lowest; the reading has none)'}
                </span>
              </td>
              <td className="px-3 py-2">
                <Sorted l={l} />
              </td>
              <td className="px-3 py-2 text-ink/70">{l.notes.join('; ') || '—'}</td>
            </tr>
          ) : (
            <tr key={l.row} className="border-t border-patina-100">
              <td className="px-3 py-2 tabular-nums">{l.row}</td>
              <td className="px-3 py-2">{l.id ?? '—'}</td>
              <td className="px-3 py-2 tabular-nums">
                {formatConductivity(l.reading.conductivitySPerM, units.conductivity)}
              </td>
              <td className="px-3 py-2 tabular-nums">
                {formatNumber(l.reading.temperatureK - 273.15)} °C
              </td>
              <td className="px-3 py-2 tabular-nums">
                {l.reading.densityKgPerM3 === null
                  ? '—'
                  : formatDensity(l.reading.densityKgPerM3, units.density)}
              </td>
              {l.status === 'none' ? (
                <td colSpan={3} className="px-3 py-2 text-ink/70">
                  No alloy in the table fits this reading.
                </td>
              ) : (
                [0, 1, 2].map((k) => (
                  <td key={k} className="px-3 py-2">
                    <Candidate c={l.candidates[k]} />
                  </td>
                ))
              )}
            </tr>
          ),
        )}
      </DataTable>
      <nav aria-label="Result pages" className="flex flex-wrap items-center gap-2 text-sm">
        <button
          type="button"
          className="rounded border border-patina-300 px-3 py-1.5 disabled:opacity-40"
          disabled={current === 0}
          onClick={() => setPage(current - 1)}
        >
          Previous page
        </button>
        <span className="tabular-nums">
          Page {current + 1} of {pages}
        </span>
        <button
          type="button"
          className="rounded border border-patina-300 px-3 py-1.5 disabled:opacity-40"
          disabled={current >= pages - 1}
          onClick={() => setPage(current + 1)}
        >
          Next page
        </button>
      </nav>
    </div>
  );
}

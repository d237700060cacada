import { IACS_100_S_PER_M } from '../../../../shared/units/conductivity';
import { useState } from 'react';
import type { Revision } from '../api/review';

/** Values in the trade's units for reading: %IACS for conductivity, g/cm³ for density. */
const scales: Record<string, [number, string]> = {
  conductivity: [IACS_100_S_PER_M / 100, ' %IACS'],
  density: [1000, ' g/cm³'],
};

const fmt = (v: unknown, key = ''): string => {
  if (v === undefined) return '—';
  if (v && typeof v === 'object' && 'nominal' in (v as object)) {
    const o = v as { nominal: number; min?: number | null; max?: number | null };
    const [k, unit] = scales[key] ?? [1, ''];
    const n = (x: number) => Number((x / k).toPrecision(5));
    return `${n(o.nominal)}${o.min != null || o.max != null ? ` (${o.min != null ? n(o.min) : '…'}–${o.max != null ? n(o.max) : '…'})` : ''}${unit}`;
  }
  return v === null ? 'none' : typeof v === 'string' ? v : JSON.stringify(v);
};

/** Before → after, field by field. */
function Diff({ revision }: { revision: Revision }) {
  if (revision.kind === 'import') {
    const set = revision.set as unknown as { kind: string; rows: unknown[] };
    return (
      <p className="text-sm">
        An import of {set.rows.length} {set.kind === 'measurements' ? 'measurements' : 'alloy rows'}
        , applied together or not at all.
      </p>
    );
  }
  if (revision.kind === 'retire')
    return <p className="text-sm">Retire this alloy from the published table.</p>;
  const set = revision.set as Record<string, unknown> & { values?: Record<string, unknown> };
  const before = (revision.before ?? {}) as Record<string, unknown> & {
    values?: Record<string, unknown>;
  };
  const rows: Array<[string, unknown, unknown]> = [];
  for (const [k, v] of Object.entries(set)) if (k !== 'values') rows.push([k, before[k], v]);
  for (const [q, v] of Object.entries(set.values ?? {})) rows.push([q, before.values?.[q], v]);
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Before and after</caption>
      <thead className="text-left text-xs text-ink/60">
        <tr>
          <th scope="col" className="pr-3">
            Field
          </th>
          <th scope="col" className="pr-3">
            Before
          </th>
          <th scope="col">After</th>
        </tr>
      </thead>
      <tbody>
        {rows.map(([k, b, a]) => (
          <tr key={k}>
            <th scope="row" className="pr-3 text-left font-medium">
              {k}
            </th>
            <td className="pr-3 tabular-nums text-copper-700 line-through decoration-copper-300">
              {fmt(b)}
            </td>
            <td className="tabular-nums text-patina-700">{fmt(a)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function RevisionCard({
  revision,
  mine,
  onDecide,
  pending,
}: {
  revision: Revision;
  mine: boolean;
  pending: boolean;
  onDecide: (decision: 'approve' | 'reject', comment: string) => void;
}) {
  const [comment, setComment] = useState('');
  const source = revision.source as unknown as {
    citation: string;
    kind: string;
    locator?: string | null;
  };
  return (
    <li className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold">
          #{revision.id} · {revision.kind} · {revision.alloy ?? 'the table'}
        </h3>
        <span className="text-xs text-ink/60">
          by {revision.author}, {new Date(revision.createdAt).toLocaleString()}
        </span>
      </div>
      <Diff revision={revision} />
      <p className="text-sm">
        <span className="font-medium">Reason:</span> {revision.reason}
      </p>
      <p className="text-sm">
        <span className="font-medium">Source ({source.kind}):</span> {source.citation}
        {source.locator ? `, ${source.locator}` : ''}
      </p>
      {mine ? (
        <p className="text-sm text-ink/70">Your own proposal: another curator reviews it.</p>
      ) : (
        <div className="flex flex-wrap items-end gap-2">
          <label className="flex flex-1 flex-col gap-1 text-sm">
            <span className="font-medium">Comment</span>
            <input
              className="rounded border border-patina-300 px-2 py-1"
              value={comment}
              onChange={(e) => setComment(e.target.value)}
            />
          </label>
          <button
            type="button"
            disabled={pending}
            className="rounded bg-patina-700 px-3 py-1.5 text-white hover:bg-patina-900"
            onClick={() => onDecide('approve', comment)}
          >
            Approve
          </button>
          <button
            type="button"
            disabled={pending}
            className="rounded border border-copper-700 px-3 py-1.5 text-copper-700"
            onClick={() => onDecide('reject', comment)}
          >
            Reject
          </button>
        </div>
      )}
    </li>
  );
}

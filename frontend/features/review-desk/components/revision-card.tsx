import { useState } from 'react';
import { describeValueChange, fieldName, formatPlainValue, isValueSet } from '../../../lib/format';
import { useMaterials } from '../../../lib/materials';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import type { Revision } from '../api/review';

const kindLabels: Record<string, string> = {
  create: 'New alloy',
  edit: 'Change',
  retire: 'Retirement',
  import: 'Import',
};

/** Before → after, field by field, in the chosen units and in words. */
function Diff({
  revision,
  units,
  nameOf,
}: {
  revision: Revision;
  units: UnitPreferences;
  nameOf: (slug: string) => string;
}) {
  if (revision.kind === 'import') {
    const set = revision.set as unknown as {
      kind: string;
      rows: Array<{ alloy?: string }>;
    };
    const alloys = [...new Set(set.rows.map((r) => r.alloy).filter(Boolean) as string[])];
    return (
      <p className="text-sm">
        An import of {set.rows.length} {set.kind === 'measurements' ? 'measurements' : 'alloy rows'}
        , applied together or not at all
        {alloys.length
          ? `: ${alloys.slice(0, 8).map(nameOf).join(', ')}${alloys.length > 8 ? '…' : ''}`
          : ''}
        .
      </p>
    );
  }
  if (revision.kind === 'retire')
    return <p className="text-sm">Retire this alloy from the published table.</p>;
  const set = revision.set as Record<string, unknown> & { values?: Record<string, unknown> };
  const before = (revision.before ?? {}) as Record<string, unknown> & {
    values?: Record<string, unknown>;
  };
  const rows: Array<{ key: string; label: string; before: string; after: string }> = [];
  for (const [k, v] of Object.entries(set))
    if (k !== 'values')
      rows.push({
        key: k,
        label: fieldName(k, units),
        before: revision.kind === 'create' ? '—' : formatPlainValue(before[k]),
        after: formatPlainValue(v),
      });
  for (const [q, v] of Object.entries(set.values ?? {})) {
    if (!isValueSet(v)) continue;
    const old = before.values?.[q];
    const change = describeValueChange(q, isValueSet(old) ? old : null, v, units);
    rows.push({ key: `values.${q}`, label: fieldName(`values.${q}`, units), ...change });
  }
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Before and after</caption>
      <thead className="text-left text-xs text-ink/70">
        <tr>
          <th scope="col" className="pr-3">
            What
          </th>
          <th scope="col" className="pr-3">
            Before
          </th>
          <th scope="col">After</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.key} className="align-top">
            <th scope="row" className="pr-3 text-left font-medium">
              {r.label}
            </th>
            <td className="pr-3 tabular-nums text-copper-700 line-through decoration-copper-300">
              {r.before}
            </td>
            <td className="tabular-nums text-patina-700">{r.after}</td>
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
  units,
}: {
  revision: Revision;
  units: UnitPreferences;
  mine: boolean;
  pending: boolean;
  onDecide: (decision: 'approve' | 'reject', comment: string) => void;
}) {
  const [comment, setComment] = useState('');
  const materials = useMaterials();
  const nameOf = (slug: string) => materials.data?.get(slug)?.name ?? slug;
  const before = revision.before as { name?: string } | null | undefined;
  const created = (revision.set as { name?: string } | undefined)?.name;
  const alloyName = revision.alloy
    ? (before?.name ?? (revision.kind === 'create' ? created : undefined) ?? nameOf(revision.alloy))
    : 'the table';
  const source = revision.source as unknown as {
    citation: string;
    kind: string;
    locator?: string | null;
  };
  return (
    <li className="flex flex-col gap-3 rounded-md border border-patina-100 bg-white p-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold">
          #{revision.id} · {kindLabels[revision.kind] ?? revision.kind} · {alloyName}
        </h3>
        <span className="text-xs text-ink/60">
          by {revision.author}, {new Date(revision.createdAt).toLocaleString()}
        </span>
      </div>
      <Diff revision={revision} units={units} nameOf={nameOf} />
      <p className="text-sm">
        <span className="font-medium">Reason:</span> {revision.reason}
      </p>
      <p className="text-sm">
        <span className="font-medium">Source ({source.kind.replace(/_/g, ' ')}):</span>{' '}
        {source.citation}
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

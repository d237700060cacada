import { DataTable } from '../../../components/data-table';
import { useHistory } from '../api/history';

const show = (v: unknown) => {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'object' && v && 'nominal' in v) {
    const o = v as { nominal: number; min?: number | null; max?: number | null };
    return `${Number(o.nominal.toPrecision(4))}${o.min != null && o.max != null ? ` (${Number(o.min.toPrecision(4))}–${Number(o.max.toPrecision(4))})` : ''}`;
  }
  return typeof v === 'string' ? v : JSON.stringify(v);
};

/** Every applied change: what, old → new (SI), who proposed and who approved it, why, on what source. */
export function HistorySection({ slug }: { slug: string }) {
  const history = useHistory(slug);
  const items = history.data?.items ?? [];
  return (
    <section aria-labelledby="history-title" className="flex flex-col gap-2">
      <h2 id="history-title" className="text-lg font-semibold">
        History
      </h2>
      {items.length === 0 ? (
        <p className="text-sm text-ink/70">No change since the table was seeded.</p>
      ) : (
        <DataTable
          caption="Applied changes to this alloy, newest first"
          headers={[
            'When',
            'Field',
            'Old → new (SI)',
            'Proposed by',
            'Approved by',
            'Reason and source',
          ]}
          minWidth="44rem"
        >
          {items.map((h, i) => (
            <tr
              key={`${h.revisionId}-${h.field}-${i}`}
              className="border-t border-patina-50 align-top"
            >
              <td className="px-3 py-1.5 whitespace-nowrap">{new Date(h.at).toLocaleString()}</td>
              <td className="px-3 py-1.5">{h.field}</td>
              <td className="px-3 py-1.5 tabular-nums">
                {show(h.oldValue)} → {show(h.newValue)}
              </td>
              <td className="px-3 py-1.5">{h.proposedBy}</td>
              <td className="px-3 py-1.5">{h.approvedBy}</td>
              <td className="px-3 py-1.5">
                {h.reason}
                <span className="block text-xs text-ink/60">{h.source.citation}</span>
              </td>
            </tr>
          ))}
        </DataTable>
      )}
    </section>
  );
}

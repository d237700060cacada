import { DataTable } from '../../../components/data-table';
import {
  describeValueChange,
  fieldName,
  formatConductivity,
  formatFrequency,
  formatPlainValue,
  isValueSet,
} from '../../../lib/format';
import type { UnitPreferences } from '../../../lib/unit-preferences';
import { useHistory, type HistoryEntry } from '../api/history';

/** Old → new of one history row in the chosen units, with "range unchanged" when it was kept. */
function change(h: HistoryEntry, units: UnitPreferences): string {
  if (h.field.startsWith('values.') && isValueSet(h.newValue)) {
    const quantity = h.field.slice('values.'.length);
    const { before, after } = describeValueChange(
      quantity,
      isValueSet(h.oldValue) ? h.oldValue : null,
      h.newValue,
      units,
    );
    return `${before} → ${after}`;
  }
  if (h.field === 'measurement' && h.newValue && typeof h.newValue === 'object') {
    const m = h.newValue as { conductivitySPerM?: number; frequencyHz?: number; sample?: string };
    return `new measurement: ${m.conductivitySPerM ? formatConductivity(m.conductivitySPerM, units.conductivity) : '—'}${m.frequencyHz ? ` at ${formatFrequency(m.frequencyHz)}` : ''}${m.sample ? `, ${m.sample}` : ''}`;
  }
  if (h.field === 'created' && h.newValue && typeof h.newValue === 'object') {
    const c = h.newValue as { name?: string; family?: string };
    return `created as ${c.name ?? '—'}${c.family ? ` (${formatPlainValue(c.family)})` : ''}`;
  }
  return `${formatPlainValue(h.oldValue)} → ${formatPlainValue(h.newValue)}`;
}

/** Every applied change: what, old → new in the chosen units, who proposed and approved it, why, on what source. */
export function HistorySection({ slug, units }: { slug: string; units: UnitPreferences }) {
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
          headers={['When', 'What', 'Old → new', 'Proposed by', 'Approved by', 'Reason and source']}
          minWidth="44rem"
        >
          {items.map((h, i) => (
            <tr
              key={`${h.revisionId}-${h.field}-${i}`}
              className="border-t border-patina-50 align-top"
            >
              <td className="px-3 py-1.5 whitespace-nowrap">{new Date(h.at).toLocaleString()}</td>
              <td className="px-3 py-1.5">{fieldName(h.field, units)}</td>
              <td className="px-3 py-1.5 tabular-nums">{change(h, units)}</td>
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

import { DataTable } from '../../../components/data-table';
import type { Checks } from '../../../lib/api-types';
import { formatShare as share } from '../../../lib/format';

type Table = Checks['table'];

const kinds: Array<{ key: keyof Table['byKind']; label: string }> = [
  { key: 'handbook', label: 'Handbook' },
  { key: 'standard', label: 'Standard' },
  { key: 'paper', label: 'Paper' },
  { key: 'measurement_set', label: 'Measurement set' },
  { key: 'from_memory', label: 'From memory (not yet checked against its page)' },
];

/** How many of the table's values rest on a located document, and of what kind. */
export function CoverageTable({ table }: { table: Table }) {
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid gap-3 sm:grid-cols-3">
        {[
          { label: 'Values in the table', value: String(table.values) },
          {
            label: 'Cited from a located document',
            value: `${table.cited} (${share(table.cited, table.values)})`,
          },
          {
            label: 'From memory',
            value: `${table.fromMemory} (${share(table.fromMemory, table.values)})`,
          },
        ].map((f) => (
          <div key={f.label} className="rounded-md border border-patina-100 bg-white px-4 py-3">
            <dt className="text-xs tracking-wide text-ink/60 uppercase">{f.label}</dt>
            <dd className="text-lg font-semibold tabular-nums">{f.value}</dd>
          </div>
        ))}
      </dl>
      <DataTable
        caption="The table's values by the kind of their source"
        headers={['Kind of source', 'Values', 'Share']}
        minWidth="24rem"
      >
        {kinds.map((k) => (
          <tr key={k.key} className="border-t border-patina-50">
            <td className="px-3 py-1.5">{k.label}</td>
            <td className="px-3 py-1.5 tabular-nums">{table.byKind[k.key]}</td>
            <td className="px-3 py-1.5 tabular-nums">{share(table.byKind[k.key], table.values)}</td>
          </tr>
        ))}
      </DataTable>
    </div>
  );
}

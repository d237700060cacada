/**
 * `npm run table:report`: how much of the reference table rests on a located document, read from
 * the seed data (no server, no database). Per quantity, the values by the kind of their source;
 * then every value not located (from memory). Exits 1 when a value cites a source id that has no
 * source row.
 */
import {
  citationCoverage,
  COVERAGE_QUANTITIES,
  SOURCE_KINDS,
  type CoverageCount,
} from '../shared/catalogue/citation-coverage';
import { referenceValues } from '../seeds/01_reference_table';

const coverage = citationCoverage(referenceValues());

const percent = (part: number, whole: number) =>
  whole === 0 ? '—' : `${((100 * part) / whole).toFixed(1)} %`;

const columns = ['quantity', 'values', ...SOURCE_KINDS, 'cited'];
const widths = [
  Math.max(...COVERAGE_QUANTITIES.map((q) => q.length), 'all'.length),
  ...columns.slice(1).map((c) => Math.max(c.length, 6)),
];
const line = (cells: string[]) =>
  cells.map((c, i) => (i === 0 ? c.padEnd(widths[0]!) : c.padStart(widths[i]!))).join('  ');
const row = (name: string, c: CoverageCount) =>
  line([
    name,
    String(c.values),
    ...SOURCE_KINDS.map((k) => String(c.byKind[k])),
    percent(c.cited, c.values),
  ]);

console.log(
  `Reference table: ${coverage.values} values, ${coverage.cited} cited from a located document (${percent(coverage.cited, coverage.values)}), ${coverage.fromMemory} from memory.`,
);
console.log('');
console.log(line(columns));
for (const q of COVERAGE_QUANTITIES) console.log(row(q, coverage.byQuantity[q]));
console.log(row('all', coverage));
console.log('');
console.log(`Not located (from memory): ${coverage.notLocated.length}`);
for (const v of coverage.notLocated)
  console.log(`  ${v.slug}  ${v.quantity}  (source ${v.sourceId})`);

if (coverage.unsourced.length > 0) {
  console.error('');
  console.error(`No source row for ${coverage.unsourced.length} value(s):`);
  for (const v of coverage.unsourced)
    console.error(`  ${v.slug}  ${v.quantity}  cites source ${v.sourceId}, which does not exist`);
  process.exitCode = 1;
}

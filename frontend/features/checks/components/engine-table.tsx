import { DataTable } from '../../../components/data-table';
import type { EngineCheck } from '../../../lib/api-types';
import { formatRelativePercent, formatSiPrefixed } from '../../../lib/format';

/** Six figures: enough to see TEAM 15-1's 0.04 % while Maxwell's 10⁻¹⁵ shows in the difference. */
const DIGITS = 6;

/** Passed or not, in words; the colour only repeats it. */
function Result({ pass }: { pass: boolean }) {
  return pass ? (
    <span className="inline-flex items-center gap-1 rounded-sm bg-patina-50 px-1.5 font-medium text-patina-900">
      <span aria-hidden="true">✓</span> Pass
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 rounded-sm bg-copper-100 px-1.5 font-medium text-copper-700">
      <span aria-hidden="true">✗</span> Fail
    </span>
  );
}

/** Every engine check: our figure, the reference, how far apart, how far they may be, the source. */
export function EngineTable({ checks }: { checks: EngineCheck[] }) {
  return (
    <DataTable
      caption="The engine's answers against their references"
      headers={['Check', 'Ours', 'Reference', 'Difference', 'Tolerance', 'Result', 'Source']}
      minWidth="60rem"
    >
      {checks.map((c) => (
        <tr key={c.id} className="border-t border-patina-50 align-top">
          <td className="px-3 py-1.5">
            {c.title}
            <span className="block text-xs text-ink/60">{c.quantity}</span>
          </td>
          <td className="px-3 py-1.5 whitespace-nowrap tabular-nums">
            {formatSiPrefixed(c.ours, c.unit, DIGITS)}
          </td>
          <td className="px-3 py-1.5 whitespace-nowrap tabular-nums">
            {formatSiPrefixed(c.reference, c.unit, DIGITS)}
          </td>
          <td className="px-3 py-1.5 whitespace-nowrap tabular-nums">
            {formatRelativePercent(c.relativeDifference)}
          </td>
          <td className="px-3 py-1.5 whitespace-nowrap tabular-nums">
            {formatRelativePercent(c.tolerance)}
          </td>
          <td className="px-3 py-1.5 whitespace-nowrap">
            <Result pass={c.pass} />
          </td>
          <td className="px-3 py-1.5 text-xs text-ink/70">{c.source}</td>
        </tr>
      ))}
    </DataTable>
  );
}

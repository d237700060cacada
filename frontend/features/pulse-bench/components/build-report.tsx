import { formatNumber } from '../../../lib/format';
import type { LaunchResult } from '../api/run-launch';

export interface SwitchRatings {
  surgeCurrentA: number;
  i2tA2s: number;
}

const percentOf = (part: number, whole: number) => `${formatNumber((part / whole) * 100, 2)} %`;

/**
 * The hardware side of one launch: the coil as it would be wound, what the switch carries against
 * its ratings, the core's peak flux density, and how long the supply takes to charge the bank.
 */
export function BuildReport({
  result,
  switchRatings,
}: {
  result: LaunchResult;
  switchRatings?: SwitchRatings;
}) {
  const rows: Array<[string, string]> = [
    ['Winding resistance', `${formatNumber(result.coil.resistanceOhm)} Ω`],
    ['Coil inductance', `${formatNumber(result.coil.inductanceH * 1e6)} µH`],
    ['Copper in the winding', `${formatNumber(result.coil.wireMassKg * 1e3)} g`],
    ['Window filled', `${formatNumber(result.coil.fillFactor * 100, 2)} %`],
    ['∫i²dt through the switch', `${formatNumber(result.i2tA2s)} A²s`],
  ];
  if (switchRatings) {
    rows.push([
      'Peak against surge rating',
      `${formatNumber(result.peakCurrentA)} A of ${formatNumber(switchRatings.surgeCurrentA)} A (${percentOf(result.peakCurrentA, switchRatings.surgeCurrentA)})`,
    ]);
    rows.push([
      '∫i²dt against I²t rating',
      `${formatNumber(result.i2tA2s)} of ${formatNumber(switchRatings.i2tA2s)} A²s (${percentOf(result.i2tA2s, switchRatings.i2tA2s)})`,
    ]);
  }
  if (result.core)
    rows.push(['Peak flux density in the core', `${formatNumber(result.core.peakFluxDensityT)} T`]);
  if (result.chargeTimeS !== undefined)
    rows.push([
      'Time to charge the bank',
      `${formatNumber(result.chargeTimeS)} s for ${formatNumber(result.energy.storedJ)} J`,
    ]);
  return (
    <table className="text-sm">
      <caption className="mb-1 text-left font-medium">The hardware</caption>
      <tbody>
        {rows.map(([label, value]) => (
          <tr key={label}>
            <th scope="row" className="pr-3 text-left font-normal text-ink/70">
              {label}
            </th>
            <td className="tabular-nums">{value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

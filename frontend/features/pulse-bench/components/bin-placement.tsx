import { formatMetres } from '../../../lib/chart-format';
import type { LaunchResult } from '../api/run-launch';

/**
 * Where two blanks land from an angled launcher, and where the divider between two collection
 * bins goes: halfway between the landing points (no drag, level floor, launch point at floor).
 */
export function BinPlacement({
  a,
  b,
  nameA,
  nameB,
}: {
  a: LaunchResult;
  b: LaunchResult;
  nameA: string;
  nameB: string;
}) {
  const far = Math.max(a.rangeM, b.rangeM, 1e-6);
  const divider = (a.rangeM + b.rangeM) / 2;
  const gap = Math.abs(a.rangeM - b.rangeM);
  const x = (r: number) => 30 + (r / far) * 280;
  return (
    <section
      aria-label="Collection bins"
      className="rounded-md border border-patina-100 bg-white p-3"
    >
      <h3 className="font-semibold">Collection bins</h3>
      <p className="text-sm">
        {nameA} lands at {formatMetres(a.rangeM)}, {nameB} at {formatMetres(b.rangeM)}:{' '}
        {formatMetres(gap)} apart. Put the divider between the bins at {formatMetres(divider)} from
        the launcher.
      </p>
      {gap < 0.02 ? (
        <p className="text-sm text-copper-700">
          Less than 2 cm apart: scatter from shape, tumbling and air will mix them. A different
          angle, voltage or gap may separate them better.
        </p>
      ) : null}
      <svg
        viewBox="0 0 380 90"
        className="mt-2 w-full max-w-xl"
        role="img"
        aria-label="Landing points and the bin divider"
      >
        <line x1="10" y1="70" x2="370" y2="70" stroke="#1d2421" />
        <rect x="12" y="55" width="12" height="15" fill="#1d5c51" />
        <circle cx={x(a.rangeM)} cy="66" r="4" fill="#1d5c51" />
        <circle cx={x(b.rangeM)} cy="66" r="4" fill="#b8642e" />
        <line
          x1={x(divider)}
          y1="40"
          x2={x(divider)}
          y2="70"
          stroke="#1d2421"
          strokeDasharray="3 2"
        />
        <text x={x(a.rangeM)} y="86" fontSize="10" textAnchor="middle" fill="#1d5c51">
          {nameA}
        </text>
        <text x={x(b.rangeM)} y="50" fontSize="10" textAnchor="middle" fill="#b8642e">
          {nameB}
        </text>
        <text x={x(divider)} y="36" fontSize="10" textAnchor="middle">
          divider
        </text>
      </svg>
    </section>
  );
}

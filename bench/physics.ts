/**
 * The engine's costs beside the committed SciPy generator's on the same inputs
 * (tests/fixtures/physics/generate.py --bench): one Dodd–Deeds point, a 200-point
 * apparent-conductivity sweep and one launch. Both agree to ~1e-11 on ΔZ (the fixture tests),
 * so the comparison is at matched accuracy.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { projectRoot } from '../backend/paths';
import { apparentConductivitySweep } from '../shared/physics/apparent-conductivity';
import { awgDiameter } from '../shared/physics/awg';
import { buildDoddDeedsKernel, impedanceAt } from '../shared/physics/dodd-deeds';
import { simulateLaunch } from '../shared/physics/launch';

const SENSOR = { innerRadiusM: 2e-3, outerRadiusM: 4e-3, lengthM: 2e-3, turns: 100 };
const layers = [
  { conductivitySPerM: 58e6, relativePermeability: 1, thicknessM: 8e-6 },
  { conductivitySPerM: 27.5 * 0.58e6, relativePermeability: 1, thicknessM: 1.34e-3 },
  { conductivitySPerM: 58e6, relativePermeability: 1, thicknessM: 8e-6 },
];
const frequencies = Array.from({ length: 200 }, (_, i) => 100 * 1e5 ** (i / 199));

/** Median of `runs` timings, seconds. */
function time(runs: number, work: () => void): number {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    work();
    samples.push((performance.now() - t) / 1000);
  }
  return samples.sort((a, b) => a - b)[Math.floor(runs / 2)]!;
}

export function benchPhysics(): void {
  const point = time(20, () => impedanceAt(buildDoddDeedsKernel(SENSOR, 0.5e-3), layers, 6e4));
  const sweep = time(5, () =>
    apparentConductivitySweep(buildDoddDeedsKernel(SENSOR, 0.5e-3), layers, frequencies),
  );
  const launch = time(5, () =>
    simulateLaunch({
      bank: { capacitanceF: 50e-6, voltageV: 400, seriesResistanceOhm: 0.05 },
      coil: {
        innerRadiusM: 5e-3,
        outerRadiusM: 12e-3,
        lengthM: 10e-3,
        turns: 100,
        wireDiameterM: awgDiameter(26),
        conductorSPerM: 58e6,
      },
      blank: {
        diameterM: 23e-3,
        layers: [
          {
            conductivitySPerM: 56 * 0.58e6,
            relativePermeability: 1,
            densityKgPerM3: 8860,
            thicknessM: 1.75e-3,
          },
        ],
      },
      gapM: 0.5e-3,
      launchAngleDeg: 90,
    }),
  );
  let scipy: { doddDeedsPointS: number; sweep200S: number; launchS: number } | null = null;
  try {
    const out = execFileSync(
      'python3',
      [path.join(projectRoot, 'tests/fixtures/physics/generate.py'), '--bench'],
      { encoding: 'utf8', timeout: 600_000 },
    );
    scipy = JSON.parse(out.trim().split('\n').at(-1)!);
  } catch (error) {
    console.log(`(SciPy side not run: ${(error as Error).message.split('\n')[0]})`);
  }
  console.log(
    '\nengine against the SciPy generator, same inputs (median of runs; the SciPy sweep is timed on 2 points × 100; ours fits every\nfrequency against one reference curve of the homogeneous plate in ωσ, SciPy fits each frequency afresh)\n',
  );
  console.log('case                                       ours ms     SciPy ms   SciPy / ours');
  const row = (name: string, ours: number, theirs: number | undefined) =>
    console.log(
      `${name.padEnd(40)} ${(ours * 1e3).toFixed(2).padStart(9)} ${theirs === undefined ? '         —' : (theirs * 1e3).toFixed(1).padStart(12)}   ${theirs === undefined ? '—' : (theirs / ours).toFixed(0) + '×'}`,
    );
  row('one Dodd–Deeds point (kernel included)', point, scipy?.doddDeedsPointS);
  row('200-point apparent-conductivity sweep', sweep, scipy?.sweep200S);
  row('one launch (4×4 coil, 8×2 blank)', launch, scipy?.launchS);
}

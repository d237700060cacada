/**
 * The engine against its references (references.ts), as rows a person can read: our answer, the
 * reference figure, their relative difference and the tolerance the unit tests hold it to.
 * Plain computation, no I/O; the server runs it on a worker thread (backend/estimates/jobs.ts).
 */
import { apparentConductivitySweep, conductivityLimits } from '../physics/apparent-conductivity';
import { buildDoddDeedsKernel, impedanceAt } from '../physics/dodd-deeds';
import { simulateLaunch } from '../physics/launch';
import { mutualInductance, mutualInductanceGradient } from '../physics/maxwell';
import { skinDepth } from '../physics/skin-depth';
import { coreChecks } from './core-checks';
import { APPARENT_CONDUCTIVITY, LAUNCH, MAXWELL, SKIN_DEPTH, TEAM_15_1 } from './references';

export interface EngineCheck {
  id: string;
  title: string;
  /** What is compared, in words ("inductance", "skin depth"). */
  quantity: string;
  ours: number;
  reference: number;
  /** SI unit of `ours` and `reference`. */
  unit: string;
  /** |ours − reference| / |reference|. */
  relativeDifference: number;
  tolerance: number;
  pass: boolean;
  source: string;
}

export const relativeDifference = (ours: number, reference: number) =>
  Math.abs(ours - reference) / Math.abs(reference);

/** A row; it passes when the relative difference is below the tolerance, as the tests assert. */
export function check(row: Omit<EngineCheck, 'relativeDifference' | 'pass'>): EngineCheck {
  const difference = relativeDifference(row.ours, row.reference);
  return { ...row, relativeDifference: difference, pass: difference < row.tolerance };
}

const frequencyText = (hz: number) =>
  hz >= 1e6 ? `${hz / 1e6} MHz` : hz >= 1e3 ? `${hz / 1e3} kHz` : `${hz} Hz`;

function team15(): EngineCheck[] {
  const t = TEAM_15_1;
  const fe = t.finiteElement;
  const p = impedanceAt(buildDoddDeedsKernel(t.coil, t.liftOffM), t.plate, t.frequencyHz);
  return [
    check({
      id: 'team-15-1-l0',
      title: 'TEAM 15-1: coil in air',
      quantity: 'inductance',
      ours: p.inductanceInAirH,
      reference: fe.inductanceInAirH,
      unit: 'H',
      tolerance: fe.tolerance,
      source: fe.source,
    }),
    check({
      id: 'team-15-1-l-over-plate',
      title: 'TEAM 15-1: coil over the plate at 900 Hz',
      quantity: 'inductance',
      ours: p.inductanceOverConductorH,
      reference: fe.inductanceOverPlateH,
      unit: 'H',
      tolerance: fe.tolerance,
      source: fe.source,
    }),
    check({
      id: 'team-15-1-delta-r',
      title: 'TEAM 15-1: resistance the plate adds at 900 Hz',
      quantity: 'ΔR',
      ours: p.deltaResistanceOhm,
      reference: fe.deltaResistanceOhm,
      unit: 'ohm',
      tolerance: fe.tolerance,
      source: fe.source,
    }),
    check({
      id: 'team-15-1-l0-measured',
      title:
        'TEAM 15-1: coil in air against the real winding (the nominal geometry reads about 2 % high)',
      quantity: 'inductance',
      ours: p.inductanceInAirH,
      reference: t.measured.inductanceInAirH,
      unit: 'H',
      tolerance: t.measured.tolerance,
      source: t.measured.source,
    }),
  ];
}

function skinDepths(): EngineCheck[] {
  return SKIN_DEPTH.cases.map((c) =>
    check({
      id: `skin-depth-copper-${c.frequencyHz}-hz`,
      title: `Skin depth of copper at ${frequencyText(c.frequencyHz)}`,
      quantity: 'skin depth',
      ours: skinDepth(c.frequencyHz, SKIN_DEPTH.conductivitySPerM),
      reference: c.depthM,
      unit: 'm',
      tolerance: SKIN_DEPTH.tolerance,
      source: SKIN_DEPTH.source,
    }),
  );
}

function maxwell(): EngineCheck[] {
  const u = MAXWELL.unitLoops;
  const m = MAXWELL.mpmath;
  const loops = (a: number, b: number, d: number) => `a = ${a} m, b = ${b} m, d = ${d} m`;
  return [
    check({
      id: 'maxwell-unit-loops-m',
      title: `Mutual inductance of two loops, ${loops(u.a, u.b, u.d)}`,
      quantity: 'mutual inductance',
      ours: mutualInductance(u.a, u.b, u.d),
      reference: u.mutualInductanceH,
      unit: 'H',
      tolerance: u.tolerance,
      source: u.source,
    }),
    check({
      id: 'maxwell-unit-loops-gradient',
      title: `Gradient dM/dd of two loops, ${loops(u.a, u.b, u.d)}`,
      quantity: 'dM/dd',
      ours: mutualInductanceGradient(u.a, u.b, u.d),
      reference: u.gradientHPerM,
      unit: 'H/m',
      tolerance: u.tolerance,
      source: u.source,
    }),
    ...m.cases.flatMap((c, i) => [
      check({
        id: `maxwell-mpmath-${i + 1}-m`,
        title: `Mutual inductance, ${loops(c.a, c.b, c.d)}`,
        quantity: 'mutual inductance',
        ours: mutualInductance(c.a, c.b, c.d),
        reference: c.M,
        unit: 'H',
        tolerance: m.tolerance(c),
        source: m.source,
      }),
      check({
        id: `maxwell-mpmath-${i + 1}-gradient`,
        title: `Gradient dM/dd, ${loops(c.a, c.b, c.d)}`,
        quantity: 'dM/dd',
        ours: mutualInductanceGradient(c.a, c.b, c.d),
        reference: c.dMdd,
        unit: 'H/m',
        tolerance: m.tolerance(c) * m.gradientFactor,
        source: m.source,
      }),
    ]),
  ];
}

function apparentConductivity(): EngineCheck[] {
  const a = APPARENT_CONDUCTIVITY;
  const kernel = buildDoddDeedsKernel(a.sensor, a.liftOffM);
  const solid = apparentConductivitySweep(kernel, a.solidBlock.layers, a.solidBlock.frequenciesHz);
  const [high] = apparentConductivitySweep(kernel, a.thickPlating.layers, [
    a.thickPlating.frequencyHz,
  ]);
  const [low] = apparentConductivitySweep(kernel, a.lowFrequency.layers, [
    a.lowFrequency.frequencyHz,
  ]);
  return [
    ...solid.map((p) =>
      check({
        id: `apparent-solid-block-${p.frequencyHz}-hz`,
        title: `A solid 32.5 MS/m block reads its own conductivity at ${frequencyText(p.frequencyHz)}`,
        quantity: 'apparent conductivity',
        ours: p.apparentConductivitySPerM,
        reference: a.solidBlock.conductivitySPerM,
        unit: 'S/m',
        tolerance: a.solidBlock.tolerance,
        source: a.solidBlock.source,
      }),
    ),
    check({
      id: 'apparent-thick-plating',
      title: '50 µm of copper on zinc reads as copper at 20 MHz',
      quantity: 'apparent conductivity',
      ours: high!.apparentConductivitySPerM,
      reference: a.thickPlating.conductivitySPerM,
      unit: 'S/m',
      tolerance: a.thickPlating.tolerance,
      source: a.thickPlating.source,
    }),
    check({
      id: 'apparent-low-frequency',
      title: 'Copper-plated zinc at 30 Hz reads the thickness-weighted mean',
      quantity: 'apparent conductivity',
      ours: low!.apparentConductivitySPerM,
      reference: conductivityLimits(a.lowFrequency.layers).thicknessWeightedMeanSPerM!,
      unit: 'S/m',
      tolerance: a.lowFrequency.tolerance,
      source: a.lowFrequency.source,
    }),
  ];
}

function launchLedger(): EngineCheck[] {
  const e = simulateLaunch(LAUNCH.input).energy;
  return [
    check({
      id: 'launch-energy-ledger',
      title: 'Launch: losses, kinetic and residual energy add up to the energy stored',
      quantity: 'energy',
      ours: e.coilLossJ + e.blankLossJ + e.kineticJ + e.residualJ,
      reference: e.storedJ,
      unit: 'J',
      tolerance: LAUNCH.ledger.tolerance,
      source: LAUNCH.ledger.source,
    }),
  ];
}

/**
 * Every group of checks, in the order the Checks screen lists them. A new benchmark is one more
 * entry here (and its figures in references.ts, asserted by a unit test too).
 */
export const ENGINE_CHECK_GROUPS: Array<{ name: string; run: () => EngineCheck[] }> = [
  { name: 'TEAM Workshop Problem 15-1', run: team15 },
  { name: 'Skin depth', run: skinDepths },
  { name: "Maxwell's mutual inductance", run: maxwell },
  { name: 'Apparent conductivity', run: apparentConductivity },
  { name: 'Launch energy ledger', run: launchLedger },
  // No published ferrite-cored coil benchmark was located in a public copy (docs/cored-coil.md):
  // exact magnetized bodies and the µr → 1 limit stand in for it.
  { name: 'Magnetic core', run: coreChecks },
];

/** Runs every check; a few hundred milliseconds of CPU, so the server runs it off the event loop. */
export function runEngineChecks(): EngineCheck[] {
  return ENGINE_CHECK_GROUPS.flatMap((g) => g.run());
}

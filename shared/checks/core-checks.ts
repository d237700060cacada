/**
 * The magnetic core against results with exact answers, for the Checks screen: magnetized bodies
 * whose magnetization is known in closed form, and the core's limit µr → 1, where the cored launch
 * must be the air-core one. No published ferrite-cored coil benchmark could be located in a public
 * copy (docs/cored-coil.md); these stand in for it.
 */
import { simulateLaunch, type LaunchInput } from '../physics/launch';
import {
  coreField,
  factorCore,
  meanMagnetization,
  uniformFieldMoments,
  type CoreCell,
} from '../physics/magnetic-core';
import { check, type EngineCheck } from './engine-checks';

/**
 * A spheroid of semi-axes a (radial) and c = aspect·a (axial) as a staircase of ring cells:
 * `slices` slices per semi-axis c, each a disc of the spheroid's volume in that slice, cut into
 * rings about as wide as the slices are thick near the equator.
 */
export function spheroidCells(a: number, aspect: number, slices: number): CoreCell[] {
  const c = aspect * a;
  const h = c / slices;
  const ringWidth = a / Math.max(2, Math.round(slices / aspect));
  const cells: CoreCell[] = [];
  for (let j = -slices; j < slices; j++) {
    const z0 = j * h;
    const z1 = (j + 1) * h;
    const radius = a * Math.sqrt(1 - (z0 * z0 + z0 * z1 + z1 * z1) / (3 * c * c));
    const rings = Math.max(1, Math.round(radius / ringWidth));
    for (let i = 0; i < rings; i++)
      cells.push({
        innerRadiusM: (i * radius) / rings,
        outerRadiusM: ((i + 1) * radius) / rings,
        bottomM: z0,
        topM: z1,
      });
  }
  return cells;
}

/** Mean axial magnetization of a body of cells in a uniform axial field of 1 A/m. */
export function magnetizationInUniformField(cells: CoreCell[], mu: number): number {
  const core = factorCore(cells, mu);
  return meanMagnetization(core, coreField(core, uniformFieldMoments(cells, 1)))[1];
}

/** Demagnetizing factor of a prolate spheroid of aspect m along its axis (Osborn 1945, eq. 2.6). */
export function prolateDemagnetizingFactor(m: number): number {
  const e = Math.sqrt(m * m - 1);
  return ((m / e) * Math.log(m + e) - 1) / (m * m - 1);
}

/** Pulse Bench's default bench with a core of µr 1.000001: what the air-core check compares. */
const mm = 1e-3;
const nearlyAir: LaunchInput = {
  bank: { capacitanceF: 50e-6, voltageV: 400, seriesResistanceOhm: 0.1 },
  coil: {
    innerRadiusM: 5 * mm,
    outerRadiusM: 9.5 * mm,
    lengthM: 4 * mm,
    turns: 100,
    wireDiameterM: 0.2019e-3, // AWG 32 (ASTM B258)
    conductorSPerM: 58e6,
  },
  blank: {
    diameterM: 19 * mm,
    layers: [
      {
        thicknessM: 1.356 * mm,
        conductivitySPerM: 0.56 * 58e6,
        relativePermeability: 1,
        densityKgPerM3: 8860,
      },
    ],
  },
  gapM: 0.5 * mm,
  launchAngleDeg: 90,
};

export function coreChecks(): EngineCheck[] {
  const sphereMu = 10;
  const m = 5;
  const spheroidMu = 1000;
  const chi = spheroidMu - 1;
  const air = simulateLaunch(nearlyAir);
  const cored = simulateLaunch({
    ...nearlyAir,
    coil: {
      ...nearlyAir.coil,
      core: {
        radiusM: 4.5 * mm,
        lengthM: 20 * mm,
        relativePermeability: 1.000001,
        saturationFluxDensityT: 1.5,
      },
    },
  });
  return [
    check({
      id: 'core-sphere',
      title: `Core model: a sphere of µr ${sphereMu} in a uniform field, 8 slices per radius`,
      quantity: 'magnetization per unit field',
      ours: magnetizationInUniformField(spheroidCells(1, 1, 8), sphereMu),
      reference: (3 * (sphereMu - 1)) / (sphereMu + 2),
      unit: '1',
      tolerance: 0.02,
      source:
        'Jackson, Classical Electrodynamics, 3rd ed., §5.10: M = 3(µr − 1)/(µr + 2)·H0 (exact); a staircase of ring cells converges as O(h)',
    }),
    check({
      id: 'core-prolate-spheroid',
      title: `Core model: a prolate spheroid of aspect ${m} and µr ${spheroidMu}`,
      quantity: 'magnetization per unit field',
      ours: magnetizationInUniformField(spheroidCells(1, m, 20), spheroidMu),
      reference: chi / (1 + chi * prolateDemagnetizingFactor(m)),
      unit: '1',
      tolerance: 0.01,
      source:
        'Osborn, Phys. Rev. 67, 351 (1945); Stoner, Phil. Mag. 36, 803 (1945): M = χH0/(1 + χN), N = 0.05582 for aspect 5',
    }),
    check({
      id: 'core-air-limit',
      title: 'Cored launch with µr → 1 (1.000001): the air-core launch of the same bench',
      quantity: 'height',
      ours: cored.heightM,
      reference: air.heightM,
      unit: 'm',
      tolerance: 1e-5,
      source: "The model's own limit: a core of µr → 1 is air (docs/cored-coil.md)",
    }),
  ];
}

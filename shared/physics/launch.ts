import {
  coilFilaments,
  selfInductanceFromFilaments,
  windingResistance,
  type CoilGeometry,
  type Filament,
} from './coil';
import { MU0, STANDARD_GRAVITY } from './constants';
import { OutsideModelError } from './errors';
import {
  mutualInductance,
  mutualInductanceAndGradient,
  rectangleGmd,
  thinRingSelfInductance,
} from './maxwell';
import {
  coreCoupling,
  coreMutualInductance,
  cylinderCoreCells,
  DEFAULT_CORE_MESH,
  factorCore,
  type CoreCoupling,
  type CoreRing,
  type CoreSpec,
} from './magnetic-core';
import { integrateRk45, StepLimitError } from './rk45';
import { stackMass, type Stack } from './stack';
import {
  adiabaticRise,
  HAZARD_HEIGHT_M,
  HAZARD_KINETIC_J,
  MAGNETIC_FROM_MU_R,
  MAX_COIL_RISE_K,
  type EstimateWarning,
} from './warnings';
import { COPPER_DENSITY_KG_PER_M3, fillFactor, heavyBuildDiameter, wireMass } from './winding';
import { ComputeTimeExceededError } from './apparent-conductivity';

export type { CoreSpec } from './magnetic-core';

export interface CapacitorBank {
  capacitanceF: number;
  voltageV: number;
  /** Switch, leads and capacitor ESR, Ω; the winding's own resistance is added to it. */
  seriesResistanceOhm: number;
  /** The capacitor's rated voltage, V: charging above it raises `bank-over-rated-voltage`. */
  ratedVoltageV?: number;
}

/**
 * A thyristor's or triac's pulse ratings: the non-repetitive surge current I_TSM (for a 10 ms
 * half-sine at 50 Hz, or 8.3 ms at 60 Hz) and the I²t for fusing; the pulse's peak current and
 * ∫i²dt are compared with them (`switch-over-rating`).
 */
export interface SwitchRating {
  surgeCurrentA: number;
  i2tA2s: number;
}

export interface DriveCoil extends CoilGeometry {
  /** Bare diameter of the wire, m. */
  wireDiameterM: number;
  conductorSPerM: number;
  /** Overall diameter over the insulation, m; heavy-build magnet wire when not given. */
  overallDiameterM?: number;
  /** Density of the conductor, kg/m³; annealed copper when not given. */
  conductorDensityKgPerM3?: number;
  /**
   * A coaxial magnetic core in the bore, its face flush with the coil face toward the blank
   * (magnetic-core.ts); an air core when not given.
   */
  core?: CoreSpec;
}

/** The drive coil as built: its winding's own figures. */
export interface CoilReport {
  /** DC resistance of the winding alone, Ω. */
  resistanceOhm: number;
  inductanceH: number;
  wireMassKg: number;
  /** Overall wire cross-sections over the window area (winding.ts). */
  fillFactor: number;
}

export interface FilamentCounts {
  coilRadial: number;
  coilAxial: number;
  blankRadial: number;
  /** Filaments through the thickness of each layer. */
  blankPerLayer: number;
  /** Ring cells of a magnetic core across its radius, when the coil has one. */
  coreRadial: number;
  /** Ring cells of a magnetic core along its length. */
  coreAxial: number;
}

export interface LaunchInput {
  bank: CapacitorBank;
  coil: DriveCoil;
  /** The blank; its first layer faces the coil. */
  blank: Stack;
  /** Coil face to blank face, m. */
  gapM: number;
  switchRating?: SwitchRating;
  /** Elevation of the launcher's axis above horizontal, degrees (90: straight up). */
  launchAngleDeg: number;
  filaments?: Partial<FilamentCounts>;
  deadline?: number;
  /** Time-series points kept (thinned evenly in time). */
  seriesPoints?: number;
}

export interface LaunchSeriesPoint {
  timeS: number;
  coilCurrentA: number;
  forceN: number;
  displacementM: number;
  speedMPerS: number;
}

export interface LaunchResult {
  peakCurrentA: number;
  peakCurrentTimeS: number;
  peakForceN: number;
  /** ∫i²dt of the drive current over the pulse, A²s. */
  i2tA2s: number;
  impulseNs: number;
  exitSpeedMPerS: number;
  heightM: number;
  rangeM: number;
  efficiency: number;
  massKg: number;
  coilInductanceH: number;
  circuitResistanceOhm: number;
  endTimeS: number;
  coil: CoilReport;
  energy: {
    storedJ: number;
    coilLossJ: number;
    blankLossJ: number;
    kineticJ: number;
    residualJ: number;
    imbalanceJ: number;
  };
  series: LaunchSeriesPoint[];
  /** What a bench builder must know beside the numbers (warnings.ts). */
  warnings: EstimateWarning[];
  /**
   * The magnetic core, when the coil has one: the largest flux density in it over the pulse, T,
   * as the mean over a cross-section of the core (the flux it carries over its area; the blank's
   * eddy currents included). Locally, at the edge next to the winding, it runs higher.
   */
  core?: { peakFluxDensityT: number };
}

export const DEFAULT_FILAMENTS: FilamentCounts = {
  coilRadial: 4,
  coilAxial: 4,
  blankRadial: 8,
  blankPerLayer: 2,
  // 144 cells: the core's share of the default coil's inductance within 1.5 % of a fine
  // finite-volume solve, in about 40 ms (docs/cored-coil.md).
  coreRadial: DEFAULT_CORE_MESH.radial,
  coreAxial: DEFAULT_CORE_MESH.axial,
};

interface BlankFilament extends Filament {
  resistanceOhm: number;
}

/** A slab of the blank that one ring of filaments stands for: one or more layers in parallel. */
interface Slice {
  zCentreM: number;
  thicknessM: number;
  /** Σσt of the layers in it, S (sheet conductance). */
  sheetConductanceS: number;
}

/**
 * Cuts the blank into slabs through its thickness. A layer thick against its skin depth at the
 * pulse's frequency gets up to `perLayer` slabs (no thinner than a radial cell); a layer much
 * thinner than its skin depth carries the same field as its neighbour and joins that neighbour's
 * nearest slab as a parallel conductance. Slicing a plating micrometres thick into filaments of
 * its own would make the circuit stiff (time constants far below the pulse's) for no gain.
 */
function blankSlices(
  blank: Stack,
  gapM: number,
  cellWidthM: number,
  perLayer: number,
  pulseHz: number,
): Slice[] {
  type Part = { z0: number; t: number; sigma: number; thin: boolean };
  const parts: Part[] = [];
  let z = gapM;
  for (const l of blank.layers) {
    // Standard depth at the pulse's frequency (skin-depth.ts), Infinity for a layer that barely
    // conducts: such a layer is thin against it and joins its neighbour.
    const delta = 1 / Math.sqrt(Math.PI * pulseHz * MU0 * 1 * l.conductivitySPerM);
    parts.push({
      z0: z,
      t: l.thicknessM,
      sigma: l.conductivitySPerM,
      thin: l.thicknessM < Math.min(cellWidthM, delta) / 3,
    });
    z += l.thicknessM;
  }
  const slices: Array<{ z0: number; z1: number; g: number; gz: number }> = [];
  const pendingThin: Part[] = [];
  const absorb = (slice: (typeof slices)[number], part: Part) => {
    slice.z0 = Math.min(slice.z0, part.z0);
    slice.z1 = Math.max(slice.z1, part.z0 + part.t);
    slice.g += part.sigma * part.t;
    slice.gz += part.sigma * part.t * (part.z0 + part.t / 2);
  };
  for (const part of parts) {
    if (part.thin) {
      if (slices.length) absorb(slices.at(-1)!, part);
      else pendingThin.push(part);
      continue;
    }
    const n = Math.min(perLayer, Math.max(1, Math.ceil(part.t / cellWidthM)));
    for (let j = 0; j < n; j++) {
      const z0 = part.z0 + (j * part.t) / n;
      const t = part.t / n;
      slices.push({ z0, z1: z0 + t, g: part.sigma * t, gz: part.sigma * t * (z0 + t / 2) });
      if (pendingThin.length) pendingThin.splice(0).forEach((p) => absorb(slices.at(-1)!, p));
    }
  }
  if (!slices.length) {
    // Every layer is thin: the blank is one slab.
    const first = pendingThin.shift()!;
    slices.push({
      z0: first.z0,
      z1: first.z0 + first.t,
      g: first.sigma * first.t,
      gz: first.sigma * first.t * (first.z0 + first.t / 2),
    });
    pendingThin.forEach((p) => absorb(slices[0]!, p));
  }
  return slices.map((sl) => ({
    zCentreM: sl.gz / sl.g,
    thicknessM: sl.z1 - sl.z0,
    sheetConductanceS: sl.g,
  }));
}

/**
 * The blank as annular filaments: radially, and through its thickness slab by slab. Annulus
 * resistance 2π/[G·ln(ro/ri)] with G = Σσt of the slab (2π/[σ·t·ln(ro/ri)] for one layer); the
 * innermost (ri = 0) uses the thin-ring 2πr/(G·Δr) instead.
 */
function blankFilaments(slices: Slice[], radiusM: number, radial: number): BlankFilament[] {
  const dr = radiusM / radial;
  const out: BlankFilament[] = [];
  for (const slice of slices) {
    for (let i = 0; i < radial; i++) {
      const ri = i * dr;
      const ro = (i + 1) * dr;
      const rm = (ri + ro) / 2;
      const g = slice.sheetConductanceS;
      const resistanceOhm =
        i === 0 ? (2 * Math.PI * rm) / (g * dr) : (2 * Math.PI) / (g * Math.log(ro / ri));
      out.push({
        radiusM: rm,
        zM: slice.zCentreM,
        turns: 1,
        gmdM: rectangleGmd(dr, slice.thicknessM),
        resistanceOhm,
      });
    }
  }
  return out;
}

const metres = (m: number) => `${Number(m.toPrecision(3))} m`;

/**
 * Damping ratio above which the discharge is refused: ζ = (R/2)·√(C/L). Far past critical damping
 * (ζ = 1) the bank leaks away through the resistance over ~RC while the circuit's own time is
 * L/R, 4ζ² times shorter: at ζ = 100 that is 40,000 times, which an explicit integrator cannot
 * bridge (it ran away to 1e215 J from a 4 J bank on a 1 µm wire of a resistive alloy), and the
 * blank would not move anyway: the peak current is about V/R.
 */
export const MAX_DAMPING_RATIO = 100;

function requireDischarge(r: number, windingOhm: number, l: number, c: number): void {
  const zeta = (r / 2) * Math.sqrt(c / l);
  if (zeta <= MAX_DAMPING_RATIO) return;
  const field = windingOhm > r / 2 ? '/body/coil' : '/body/bank/seriesResistance';
  throw new OutsideModelError(
    field,
    `the circuit's resistance (${Number(r.toPrecision(3))} Ω${windingOhm > r / 2 ? `, ${Number(windingOhm.toPrecision(3))} Ω of it in the winding` : ''}) is ${Number((zeta / MAX_DAMPING_RATIO).toPrecision(2))} × too high for a pulse: the bank would leak away through it (damping ratio ${Number(zeta.toPrecision(3))}, above ${MAX_DAMPING_RATIO}) and the blank would not move. Use thicker wire, a better conductor or less series resistance.`,
  );
}

/**
 * The thin-ring formula L = µ0·a·(ln(8a/g) − 2) holds for a cross-section small against its
 * ring, and turns negative once g > 8a/e²: a filament that fat is outside the filament model.
 * Left unchecked, a negative self-inductance lets the circuit make energy (a 5 mm aluminium slug
 * of 20 mm under the default filaments left at 56 times the energy stored).
 */
function requireThinRings(cells: Filament[], field: string, what: string, advice: string): void {
  for (const c of cells) {
    if (thinRingSelfInductance(c.radiusM, c.gmdM) > 0) continue;
    throw new OutsideModelError(
      field,
      `a filament of the ${what} (a ring of ${metres(c.radiusM)} radius, about ${metres(c.gmdM / 0.2235)} across its cross-section) is not small against its ring, where the filament model holds: ${advice}`,
    );
  }
}

/** True when a symmetric matrix is positive definite (Cholesky runs to the end with positive pivots). */
function positiveDefinite(matrix: Float64Array, n: number): boolean {
  const l = new Float64Array(n * n);
  for (let j = 0; j < n; j++) {
    let d = matrix[j * n + j]!;
    for (let k = 0; k < j; k++) d -= l[j * n + k]! ** 2;
    if (!(d > 0)) return false;
    const root = Math.sqrt(d);
    l[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let v = matrix[i * n + j]!;
      for (let k = 0; k < j; k++) v -= l[i * n + k]! * l[j * n + k]!;
      l[i * n + j] = v / root;
    }
  }
  return true;
}

const CORE_FIELD = '/body/coil/core';

/**
 * A core the moment method can take: a positive, finite radius and length, a radius within the
 * winding's bore (the model puts the whole winding outside the core), a linear magnetic material
 * (finite µr ≥ 1) and a positive saturation flux density to warn against.
 */
function requireCore(core: CoreSpec, coil: DriveCoil): void {
  const positive = (x: number) => Number.isFinite(x) && x > 0;
  if (!positive(core.radiusM) || !positive(core.lengthM))
    throw new OutsideModelError(
      CORE_FIELD,
      `a core needs a positive, finite radius and length (given ${core.radiusM} m and ${core.lengthM} m)`,
    );
  if (core.radiusM > coil.innerRadiusM)
    throw new OutsideModelError(
      CORE_FIELD,
      `a core of ${metres(core.radiusM)} radius does not fit the winding's bore of ${metres(coil.innerRadiusM)} radius: the model puts the core inside the winding`,
    );
  if (!(Number.isFinite(core.relativePermeability) && core.relativePermeability >= 1))
    throw new OutsideModelError(
      CORE_FIELD,
      `a core's relative permeability must be a finite number of at least 1 (given ${core.relativePermeability}): the model takes linear magnetic materials, not diamagnetic ones`,
    );
  if (!positive(core.saturationFluxDensityT))
    throw new OutsideModelError(
      CORE_FIELD,
      `a core needs a positive, finite saturation flux density (given ${core.saturationFluxDensityT} T)`,
    );
}

/**
 * The core, when the coil has one, cut into cells and factored once (magnetic-core.ts); the
 * winding's extra self-inductance from it, H.
 */
function prepareCore(coil: DriveCoil, coilCells: Filament[], counts: FilamentCounts) {
  if (!coil.core) return undefined;
  requireCore(coil.core, coil);
  const mesh = {
    radial: Math.max(1, Math.round(counts.coreRadial)),
    axial: Math.max(1, Math.round(counts.coreAxial)),
  };
  let factored;
  try {
    factored = factorCore(
      cylinderCoreCells(coil.core.radiusM, coil.core.lengthM, mesh),
      coil.core.relativePermeability,
    );
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    throw new OutsideModelError(
      '/body/filaments',
      "the core's moment-method system came out singular: cut the core into more cells (filaments.coreRadial, filaments.coreAxial)",
    );
  }
  return {
    spec: coil.core,
    factored,
    extraInductanceH: coreMutualInductance(factored, coilCells.map(asRing)),
  };
}

const asRing = (f: Filament): CoreRing => ({ radiusM: f.radiusM, zM: f.zM, turns: f.turns });

const COARSE_FILAMENTS =
  'use more filaments (filaments.coilRadial, coilAxial, blankRadial), each then small against the gap, or a wider gap';

/** Inverse of a small dense symmetric matrix by Gauss–Jordan with partial pivoting. */
function invert(matrix: Float64Array, n: number): Float64Array {
  const a = Float64Array.from(matrix);
  const inv = new Float64Array(n * n);
  for (let i = 0; i < n; i++) inv[i * n + i] = 1;
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r * n + c]!) > Math.abs(a[p * n + c]!)) p = r;
    if (p !== c) {
      for (let j = 0; j < n; j++) {
        [a[c * n + j], a[p * n + j]] = [a[p * n + j]!, a[c * n + j]!];
        [inv[c * n + j], inv[p * n + j]] = [inv[p * n + j]!, inv[c * n + j]!];
      }
    }
    const d = a[c * n + c]!;
    for (let j = 0; j < n; j++) {
      a[c * n + j]! /= d;
      inv[c * n + j]! /= d;
    }
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r * n + c]!;
      if (f === 0) continue;
      for (let j = 0; j < n; j++) {
        a[r * n + j]! -= f * a[c * n + j]!;
        inv[r * n + j]! -= f * inv[c * n + j]!;
      }
    }
  }
  return inv;
}

/**
 * A capacitor discharging through a drive coil under a conducting blank: coupled circuits, one
 * per filament (the filament method used in published induction-launcher models, e.g. Andrews &
 * Devine, IEEE Trans. Magn. 27, 639, 1991):
 *   q̇ = −i1;  L1·i̇1 + Σ Mk·i̇k + v·Σ M′k·ik + R1·i1 = q/C;
 *   Lk·i̇k + Mk·i̇1 + Σj Mkj·i̇j + v·M′k·i1 + Rk·ik = 0;
 *   m·v̇ = i1·Σ ik·M′k − m·g·sin θ;  ż = v,
 * integrated with adaptive RK45 until the blank has left the field (the circuit holds under
 * 0.01 % of the stored energy and the force is below a thousandth of its peak, or the blank is
 * three coil radii away). Mutuals by Maxwell,
 * self-inductances by the thin-ring formula.
 *
 * With a magnetic core in the bore (`coil.core`, magnetic-core.ts) every inductance gains the
 * core's share: L1 a constant one, the coil–blank mutuals one that depends on s, and the blank's
 * own matrix Lb(s) too (its eddy currents and their image in the core). The circuit is then
 * d/dt(L(s)·i) + R·i = v, that is L·i̇ = v − R·i − v_s·L′(s)·i, with the force ½·iᵀ·L′(s)·i
 * = i1·Σ M′k·ik + ½·ibᵀ·Lb′·ib, so the energy ledger still closes. Without a core the
 * arithmetic is exactly that of the air-core model. The blank rests on the coil face until the force
 * lifts it. No air drag; height and range are those of a point mass leaving from where the
 * simulation ends, at the speed it has there ({@link ballistics}): the apex counts the rise made
 * during the pulse.
 */
export function simulateLaunch(input: LaunchInput): LaunchResult {
  const counts = { ...DEFAULT_FILAMENTS, ...input.filaments };
  const { bank, coil, blank, gapM } = input;
  const theta = (input.launchAngleDeg * Math.PI) / 180;
  const gAxis = STANDARD_GRAVITY * Math.sin(theta);
  const mass = stackMass(blank);
  if (!(mass > 0 && Number.isFinite(mass)))
    throw new OutsideModelError(
      '/body/blank/diameter',
      `a blank ${metres(blank.diameterM)} across has no mass a double can hold`,
    );

  const coilCells = coilFilaments(coil, counts.coilRadial, counts.coilAxial);
  requireThinRings(
    coilCells,
    '/body/coil',
    'drive coil',
    'give more coil filaments (filaments.coilRadial, filaments.coilAxial), or a winding section small against its radius',
  );
  const core = prepareCore(coil, coilCells, counts);
  // With a core the winding's inductance includes the core's share (constant: both are fixed).
  const l1 = core
    ? selfInductanceFromFilaments(coilCells) + core.extraInductanceH
    : selfInductanceFromFilaments(coilCells);
  const windingOhm = windingResistance(coil, coil.wireDiameterM, coil.conductorSPerM);
  const r1 = bank.seriesResistanceOhm + windingOhm;
  requireDischarge(r1, windingOhm, l1, bank.capacitanceF);
  const pulseHz = 1 / (2 * Math.PI * Math.sqrt(l1 * bank.capacitanceF));
  const slices = blankSlices(
    blank,
    gapM,
    blank.diameterM / 2 / counts.blankRadial,
    counts.blankPerLayer,
    pulseHz,
  );
  const cells = blankFilaments(slices, blank.diameterM / 2, counts.blankRadial);
  requireThinRings(
    cells,
    '/body/blank',
    'blank',
    'give more filaments through its thickness (filaments.blankPerLayer) or fewer across it (filaments.blankRadial)',
  );
  const leaky = cells.find((c) => !(c.resistanceOhm > 0 && Number.isFinite(c.resistanceOhm)));
  if (leaky)
    throw new OutsideModelError(
      '/body/blank/layers',
      'the blank conducts too little to carry an eddy current this model can compute: its layers need a conductivity',
    );
  const nb = cells.length;
  const exitDistance = 3 * coil.outerRadiusM;
  const coreTables = core && coreTablesFor(core.factored, coilCells, cells, exitDistance);

  // In air the blank's own inductance matrix is constant (it moves rigidly): invert it once. Over
  // a core it depends on s as well (the eddy currents' image in the core): `lbNow` below.
  const lb = new Float64Array(nb * nb);
  for (let i = 0; i < nb; i++) {
    const a = cells[i]!;
    lb[i * nb + i] = thinRingSelfInductance(a.radiusM, a.gmdM);
    for (let j = i + 1; j < nb; j++) {
      const b = cells[j]!;
      // Cells closer than their own size couple through their cross-sections, not as thin
      // lines: the separation is widened by the cells' geometric mean distances, which keeps
      // Mij below √(Li·Lj) and the matrix positive definite (it tends to Li as they merge).
      const m = mutualInductance(
        a.radiusM,
        b.radiusM,
        Math.sqrt((a.zM - b.zM) ** 2 + a.gmdM * b.gmdM),
      );
      lb[i * nb + j] = m;
      lb[j * nb + i] = m;
    }
  }
  // The circuits must store energy for any currents: a matrix that is not positive definite lets
  // them make it, and the integration runs away (1e148 A from a 33 J bank).
  if (
    !positiveDefinite(lb, nb) ||
    (coreTables &&
      !positiveDefinite(coreTables.at(0, lb, new Float64Array(nb), new Float64Array(nb)).lb, nb))
  )
    throw new OutsideModelError(
      '/body/filaments',
      `the blank's filaments couple more tightly than their self-inductances allow: ${COARSE_FILAMENTS}`,
    );
  const lbInv = invert(lb, nb);

  const mk = new Float64Array(nb);
  const dmk = new Float64Array(nb);
  // Over a core: the blank's inductance matrix at s, its s-derivative and the inverse used below.
  let lbNow = lb;
  let lbInvNow = lbInv;
  let dlbNow = new Float64Array(nb * nb);
  /** Coil-to-filament mutuals and their gradients with the blank displaced by s (and, over a core, the blank's own matrix at s). */
  const coupling = (s: number) => {
    for (let k = 0; k < nb; k++) {
      const f = cells[k]!;
      let m = 0;
      let dm = 0;
      for (const c of coilCells) {
        const [mm, dd] = mutualInductanceAndGradient(c.radiusM, f.radiusM, f.zM + s - c.zM);
        m += c.turns * mm;
        dm += c.turns * dd;
      }
      mk[k] = m;
      dmk[k] = dm;
    }
    if (coreTables) {
      ({ lb: lbNow, dlb: dlbNow } = coreTables.at(s, lb, mk, dmk));
      lbInvNow = invert(lbNow, nb);
    }
  };

  // State: q, i1, i_b[nb], s, v, coil loss, blank loss, impulse.
  const iq = 0;
  const i1 = 1;
  const ib = 2;
  const is = ib + nb;
  const iv = is + 1;
  const iec = iv + 1;
  const ieb = iec + 1;
  const iimp = ieb + 1;
  const n = iimp + 1;
  const rb = new Float64Array(nb);
  const x = new Float64Array(nb);
  const u = new Float64Array(nb);
  let lastForce = 0;

  // The same for the whole circuit at rest on the coil face, where the coupling is strongest: the
  // coil's inductance with the blank's currents free, L1 − mᵀLb⁻¹m, must stay positive. Thin-line
  // mutuals between filaments closer than their own cross-sections can drive it below zero.
  coupling(0);
  let shielded = l1;
  for (let r = 0; r < nb; r++) {
    let su = 0;
    for (let c = 0; c < nb; c++) su += lbInvNow[r * nb + c]! * mk[c]!;
    shielded -= mk[r]! * su;
  }
  if (!(shielded > 0))
    throw new OutsideModelError(
      '/body/filaments',
      `the drive coil and the blank couple more tightly than the filament model allows (the coil's inductance with the blank present comes out at ${Number(shielded.toPrecision(3))} H): ${COARSE_FILAMENTS}`,
    );

  const derivative = (_t: number, y: Float64Array, dy: Float64Array) => {
    const s = y[is]!;
    const v = y[iv]!;
    const current = y[i1]!;
    coupling(s);
    let force = 0;
    let motional = 0;
    let blankLoss = 0;
    for (let k = 0; k < nb; k++) {
      const ik = y[ib + k]!;
      force += ik * dmk[k]!;
      motional += dmk[k]! * ik;
      rb[k] = -cells[k]!.resistanceOhm * ik - v * dmk[k]! * current;
      blankLoss += cells[k]!.resistanceOhm * ik * ik;
    }
    force *= current;
    // Over a core the blank's own matrix varies with s too: d/dt(Lb·ib) = Lb·i̇b + v·Lb′·ib, and the
    // force gains ½·ibᵀ·Lb′·ib (the eddy currents drawn toward their image in the core).
    if (coreTables) force += blankImageTerms(y, ib, v, nb, dlbNow, rb);
    const rc = y[iq]! / bank.capacitanceF - r1 * current - v * motional;
    // Block elimination: i̇b = Lb⁻¹(rb − m·i̇1); i̇1 = (rc − mᵀLb⁻¹rb)/(L1 − mᵀLb⁻¹m).
    let mx = 0;
    let mu = 0;
    for (let r = 0; r < nb; r++) {
      let sx = 0;
      let su = 0;
      for (let c = 0; c < nb; c++) {
        const w = lbInvNow[r * nb + c]!;
        sx += w * rb[c]!;
        su += w * mk[c]!;
      }
      x[r] = sx;
      u[r] = su;
      mx += mk[r]! * sx;
      mu += mk[r]! * su;
    }
    const di1 = (rc - mx) / (l1 - mu);
    dy[iq] = -current;
    dy[i1] = di1;
    for (let k = 0; k < nb; k++) dy[ib + k] = x[k]! - u[k]! * di1;
    let accel = force / mass - gAxis;
    // Resting on the coil face: the support holds it until the force lifts it (and does no work).
    if (s <= 0 && v <= 0 && accel < 0) accel = 0;
    dy[is] = s <= 0 && v < 0 ? 0 : v;
    dy[iv] = accel;
    dy[iec] = r1 * current * current;
    dy[ieb] = blankLoss;
    dy[iimp] = force;
    lastForce = force;
  };

  const stored = 0.5 * bank.capacitanceF * bank.voltageV ** 2;
  const y0 = new Float64Array(n);
  y0[iq] = bank.capacitanceF * bank.voltageV;
  const characteristicTime = Math.sqrt(l1 * bank.capacitanceF);
  const currentScale = bank.voltageV / Math.sqrt(l1 / bank.capacitanceF);
  const atol = new Float64Array(n);
  atol[iq] = 1e-9 * y0[iq]!;
  for (let k = i1; k < is; k++) atol[k] = 1e-7 * currentScale;
  atol[is] = 1e-9;
  atol[iv] = 1e-7;
  atol[iec] = atol[ieb] = 1e-9 * stored;
  atol[iimp] = 1e-12;

  let peakCurrent = 0;
  let peakCurrentTime = 0;
  let peakForce = 0;
  let peakFluxDensity = 0;
  const samples: LaunchSeriesPoint[] = [];
  const maxTime = Math.max(200 * characteristicTime, 1e-3);
  let result;
  try {
    result = integrateRk45(derivative, 0, y0, {
      rtol: 1e-6,
      atol,
      firstStep: characteristicTime * 1e-3,
      // Small enough that the sampled peaks of current and force sit within a few per cent of LC time.
      maxStep: characteristicTime / 16,
      maxSteps: 200_000,
      deadline: input.deadline,
      onStep: (t, y) => {
        const current = Math.abs(y[i1]!);
        if (current > peakCurrent) {
          peakCurrent = current;
          peakCurrentTime = t;
        }
        peakForce = Math.max(peakForce, lastForce);
        if (coreTables)
          peakFluxDensity = Math.max(
            peakFluxDensity,
            coreTables.peakFluxDensity(y[is]!, y[i1]!, y.subarray(ib, ib + nb)),
          );
        samples.push({
          timeS: t,
          coilCurrentA: y[i1]!,
          forceN: lastForce,
          displacementM: y[is]!,
          speedMPerS: y[iv]!,
        });
        // Done when the circuit holds almost none of the stored energy and the force has died
        // away (a current zero alone is not enough: an underdamped bank swings back).
        const left = (0.5 * y[iq]! ** 2) / bank.capacitanceF + 0.5 * l1 * y[i1]! ** 2;
        const settled =
          t > peakCurrentTime && left < 1e-4 * stored && Math.abs(lastForce) < 1e-3 * peakForce;
        return settled || y[is]! > exitDistance || t > maxTime;
      },
    });
  } catch (error) {
    if (error instanceof StepLimitError) throw new ComputeTimeExceededError();
    throw error;
  }
  const { t: endTime, y } = result;

  // What is left: charge on the capacitor, the field of the circuits, and height gained.
  coupling(y[is]!);
  const currents = Array.from({ length: nb }, (_, k) => y[ib + k]!);
  let magnetic = 0.5 * l1 * y[i1]! ** 2;
  for (let k = 0; k < nb; k++) {
    magnetic += mk[k]! * y[i1]! * currents[k]!;
    for (let j = 0; j < nb; j++) magnetic += 0.5 * lbNow[k * nb + j]! * currents[k]! * currents[j]!;
  }
  const speed = Math.max(0, y[iv]!);
  const kinetic = 0.5 * mass * y[iv]! ** 2;
  const residual = (0.5 * y[iq]! ** 2) / bank.capacitanceF + magnetic + mass * gAxis * y[is]!;
  const coilLoss = y[iec]!;
  const blankLoss = y[ieb]!;
  const wireMassKg = wireMass(
    coil,
    coil.wireDiameterM,
    coil.conductorDensityKgPerM3 ?? COPPER_DENSITY_KG_PER_M3,
  );
  const { heightM, rangeM } = ballistics(y[is]!, speed, theta);
  // The coil-side loss is ∫r1·i1²dt with r1 constant: the let-through integral follows exactly.
  const i2tA2s = coilLoss / r1;
  // Deny by default: an answer whose ledger is not finite is not an answer (a stiff circuit the
  // checks above let through would otherwise reach the client as NaN or 1e215 J).
  const ledger = [coilLoss, blankLoss, kinetic, residual, speed, heightM];
  if (
    !ledger.every(Number.isFinite) ||
    Math.abs(stored - coilLoss - blankLoss - kinetic - residual) > stored
  )
    throw new OutsideModelError(
      '/body',
      'the simulation did not settle to a finite answer for this circuit: check the bank, the wire and the blank against what can be built',
    );
  const warnings = launchWarnings({
    bank,
    switchRating: input.switchRating,
    peakCurrentA: peakCurrent,
    i2tA2s,
    blank,
    windingLossJ: (coilLoss * windingOhm) / r1,
    wireMassKg,
    heightM,
    speedMPerS: speed,
    kineticJ: kinetic,
    core: core && {
      peakFluxDensityT: peakFluxDensity,
      saturationFluxDensityT: core.spec.saturationFluxDensityT,
    },
  });
  return {
    peakCurrentA: peakCurrent,
    peakCurrentTimeS: peakCurrentTime,
    peakForceN: peakForce,
    i2tA2s,
    impulseNs: y[iimp]!,
    exitSpeedMPerS: speed,
    heightM,
    rangeM,
    efficiency: kinetic / stored,
    massKg: mass,
    coilInductanceH: l1,
    circuitResistanceOhm: r1,
    endTimeS: endTime,
    coil: {
      resistanceOhm: windingOhm,
      inductanceH: l1,
      wireMassKg,
      fillFactor: fillFactor(coil, coil.overallDiameterM ?? heavyBuildDiameter(coil.wireDiameterM)),
    },
    energy: {
      storedJ: stored,
      coilLossJ: coilLoss,
      blankLossJ: blankLoss,
      kineticJ: kinetic,
      residualJ: residual,
      imbalanceJ: stored - coilLoss - blankLoss - kinetic - residual,
    },
    series: thin(samples, input.seriesPoints ?? 300),
    warnings,
    ...(core ? { core: { peakFluxDensityT: peakFluxDensity } } : {}),
  };
}

/**
 * The core's tables for this launch (magnetic-core.ts), tabulated a fifth beyond the distance at
 * which the blank is taken to have left, and the small steps that fold them into the circuit.
 */
function coreTablesFor(
  factored: ReturnType<typeof factorCore>,
  coilCells: Filament[],
  cells: BlankFilament[],
  exitDistance: number,
) {
  const nb = cells.length;
  if (cells.some((c) => !(c.zM > 0)))
    throw new OutsideModelError(
      '/body/gap',
      'over a core the blank must sit above the core face (a gap of zero or more)',
    );
  const tables: CoreCoupling = coreCoupling(
    factored,
    coilCells.map(asRing),
    cells.map(asRing),
    1.2 * exitDistance,
  );
  const dm = new Float64Array(nb);
  const ddm = new Float64Array(nb);
  const dlb = new Float64Array(nb * nb);
  const blank = new Float64Array(nb * nb);
  const blankGradient = new Float64Array(nb * nb);
  return {
    /**
     * At s: adds the core's share to the coil–filament mutuals `mk` and their gradients `dmk`,
     * and returns the blank's own matrix (air-core `lbAir` plus the core's share) and its
     * s-derivative. The arrays returned are overwritten by the next call.
     */
    at(s: number, lbAir: Float64Array, mk: Float64Array, dmk: Float64Array) {
      tables.at(s, dm, ddm, dlb, blankGradient);
      for (let k = 0; k < nb; k++) {
        mk[k] = mk[k]! + dm[k]!;
        dmk[k] = dmk[k]! + ddm[k]!;
      }
      for (let i = 0; i < nb * nb; i++) blank[i] = lbAir[i]! + dlb[i]!;
      return { lb: blank, dlb: blankGradient };
    },
    peakFluxDensity: tables.peakFluxDensity,
  };
}

/**
 * The blank's own motional term and force over a core: subtracts v·Lb′·ib from the filaments'
 * right-hand sides `rb` and returns ½·ibᵀ·Lb′·ib, N.
 */
function blankImageTerms(
  y: Float64Array,
  ib: number,
  v: number,
  nb: number,
  dlb: Float64Array,
  rb: Float64Array,
): number {
  let force = 0;
  for (let k = 0; k < nb; k++) {
    let row = 0;
    for (let j = 0; j < nb; j++) row += dlb[k * nb + j]! * y[ib + j]!;
    rb[k] = rb[k]! - v * row;
    force += 0.5 * y[ib + k]! * row;
  }
  return force;
}

const figure = (x: number) => Number(x.toPrecision(3));

/**
 * Apex and range of a point mass (no drag) that is `displacementM` along the launcher's axis from
 * its starting position, moving along it at `speedMPerS`, the axis at `theta` above horizontal:
 * apex = s·sin θ + (v·sin θ)²/2g above the start, the rise made during the pulse included;
 * range = s·cos θ + v·cos θ·t, where t solves s·sin θ + v·sin θ·t − g·t²/2 = 0 (landing at the
 * starting height). Projectile motion in uniform gravity (any mechanics text).
 * @example ballistics(0.01, 2, Math.PI / 2) // { heightM: 0.2139…, rangeM: ~0 }
 */
export function ballistics(
  displacementM: number,
  speedMPerS: number,
  theta: number,
): { heightM: number; rangeM: number } {
  const g = STANDARD_GRAVITY;
  const y0 = displacementM * Math.sin(theta);
  const vy = speedMPerS * Math.sin(theta);
  const vx = speedMPerS * Math.cos(theta);
  const flight = (vy + Math.sqrt(vy * vy + 2 * g * Math.max(0, y0))) / g;
  return {
    heightM: y0 + (vy * vy) / (2 * g),
    rangeM: displacementM * Math.cos(theta) + vx * flight,
  };
}

/**
 * The warnings of one launch: a magnetic layer the model treats as non-magnetic; the winding's
 * adiabatic temperature rise above its insulation class (IEC 60085, warnings.ts); a blank that
 * rises above head height or leaves with more than 1 J; a bank or switch over its ratings; a
 * core driven past its saturation flux density (the model takes it as linear).
 */
function launchWarnings(l: {
  bank: CapacitorBank;
  switchRating: SwitchRating | undefined;
  peakCurrentA: number;
  i2tA2s: number;
  blank: Stack;
  windingLossJ: number;
  wireMassKg: number;
  heightM: number;
  speedMPerS: number;
  kineticJ: number;
  core?: { peakFluxDensityT: number; saturationFluxDensityT: number };
}): EstimateWarning[] {
  const warnings: EstimateWarning[] = [];
  if (l.blank.layers.some((layer) => layer.relativePermeability > MAGNETIC_FROM_MU_R))
    warnings.push({
      code: 'magnetic-layer',
      message:
        'A layer is magnetic: the model treats it as non-magnetic. A ferromagnetic blank is also pulled toward the coil, so it flies lower than shown, or not at all.',
    });
  const rise = adiabaticRise(l.windingLossJ, l.wireMassKg);
  if (rise > MAX_COIL_RISE_K)
    warnings.push({
      code: 'coil-heating',
      message: `The winding heats by about ${figure(rise)} K in one pulse (${figure(l.windingLossJ)} J in ${figure(l.wireMassKg * 1e3)} g of copper, adiabatic), above the ${MAX_COIL_RISE_K} K that thermal class 155 (F) insulation (IEC 60085) allows from a 40 °C ambient: the enamel chars and the turns short.`,
    });
  if (l.heightM > HAZARD_HEIGHT_M || l.kineticJ > HAZARD_KINETIC_J)
    warnings.push({
      code: 'projectile-hazard',
      message: `The blank rises ${figure(l.heightM)} m and leaves at ${figure(l.speedMPerS)} m/s with ${figure(l.kineticJ)} J: above head height (${HAZARD_HEIGHT_M} m) or ${HAZARD_KINETIC_J} J it can injure an eye or a face. Shield the bench and wear eye protection.`,
    });
  const rated = l.bank.ratedVoltageV;
  if (rated !== undefined && l.bank.voltageV > rated)
    warnings.push({
      code: 'bank-over-rated-voltage',
      message: `The bank is charged to ${figure(l.bank.voltageV)} V, above its rated ${figure(rated)} V (${figure((l.bank.voltageV / rated - 1) * 100)} % over): outside the capacitor's datasheet, whatever the result; it may fail short or vent.`,
    });
  const sw = l.switchRating;
  if (sw && (l.peakCurrentA > sw.surgeCurrentA || l.i2tA2s > sw.i2tA2s)) {
    const over: string[] = [];
    if (l.peakCurrentA > sw.surgeCurrentA)
      over.push(
        `a peak of ${figure(l.peakCurrentA)} A against its ${figure(sw.surgeCurrentA)} A surge rating`,
      );
    if (l.i2tA2s > sw.i2tA2s)
      over.push(`∫i²dt of ${figure(l.i2tA2s)} A²s against its ${figure(sw.i2tA2s)} A²s I²t rating`);
    warnings.push({
      code: 'switch-over-rating',
      message: `The switch is over its ratings: ${over.join(' and ')}. A thyristor's surge rating is for one 10 ms half-sine; beyond it the junction can fail short.`,
    });
  }
  const core = l.core;
  if (core && core.peakFluxDensityT > core.saturationFluxDensityT)
    warnings.push({
      code: 'core-saturation',
      message: `The core's flux density peaks at about ${figure(core.peakFluxDensityT)} T, above its saturation flux density of ${figure(core.saturationFluxDensityT)} T: past saturation the core adds little more field, and this estimate, which takes the core as linear, overstates the launch.`,
    });
  return warnings;
}

/** Keeps about `count` samples, evenly spaced in time, always the first and the last. */
function thin(samples: LaunchSeriesPoint[], count: number): LaunchSeriesPoint[] {
  if (samples.length <= count) return samples;
  const end = samples.at(-1)!.timeS;
  const out: LaunchSeriesPoint[] = [];
  let next = 0;
  for (const s of samples) {
    if (s.timeS >= next) {
      out.push(s);
      next = s.timeS + end / count;
    }
  }
  if (out.at(-1) !== samples.at(-1)) out.push(samples.at(-1)!);
  return out;
}

import {
  coilInAirInductance,
  impedanceAt,
  type ConductorLayer,
  type DoddDeedsKernel,
} from './dodd-deeds';
import { OutsideModelError } from './errors';

export interface ApparentConductivityPoint {
  frequencyHz: number;
  apparentConductivitySPerM: number;
  /** |ΔZn(fit) − ΔZn(stack)| / |ΔZn(stack)| in the normalised impedance plane. */
  fitResidual: number;
  /** The stack's own normalised impedance at this frequency. */
  normalizedResistance: number;
  normalizedReactance: number;
}

export interface ConductivityLimits {
  /** Σσd/Σd over the layers: the low-frequency limit of a finite stack (null with a half-space). */
  thicknessWeightedMeanSPerM: number | null;
  /** The face layer's σ: the high-frequency limit. */
  surfaceLayerSPerM: number;
  /** What the reading tends to at low frequency: the weighted mean, or the half-space's σ. */
  lowFrequencySPerM: number;
}

/** Conductivities an instrument calibrated on non-magnetic blocks can report, S/m. */
export const SIGMA_RANGE: [number, number] = [1e5, 2e8];
/** Grid density of the homogeneous reference curve, points per decade of ωσ. */
const POINTS_PER_DECADE = 60;

export function conductivityLimits(layers: ConductorLayer[]): ConductivityLimits {
  const halfSpace = layers.at(-1)!.thicknessM === null;
  let sd = 0;
  let d = 0;
  for (const l of layers) {
    if (l.thicknessM === null) continue;
    sd += l.conductivitySPerM * l.thicknessM;
    d += l.thicknessM;
  }
  const mean = halfSpace ? null : sd / d;
  return {
    thicknessWeightedMeanSPerM: mean,
    surfaceLayerSPerM: layers[0]!.conductivitySPerM,
    lowFrequencySPerM: mean ?? layers.at(-1)!.conductivitySPerM,
  };
}

/** Normalised ΔZ (re, im) of homogeneous plates against ln(ωσ), on an even grid. */
export type ReferenceCurve = { logP: Float64Array; re: Float64Array; im: Float64Array };
type Curve = ReferenceCurve;

/**
 * The homogeneous, non-magnetic reference plate of the stack's thickness, as normalised ΔZ
 * against log(ωσ): for such a plate α₁ = √(α² + jωµ0σ) depends on ω and σ only through their
 * product, and ΔZ/X0 does not depend on ω otherwise, so one curve serves every frequency.
 */
export function referenceCurve(
  kernel: DoddDeedsKernel,
  thicknessM: number | null,
  pMin: number,
  pMax: number,
  l0: number,
  deadline?: number,
): Curve {
  // Differences of logs, not the log of a ratio that overflows when the sweep spans 300 decades.
  const decades = Math.log10(pMax) - Math.log10(pMin);
  const n = Math.max(8, Math.ceil(decades * POINTS_PER_DECADE));
  const logP = new Float64Array(n);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  const f = 1 / (2 * Math.PI); // ω = 1: the conductivity of the layer is then ωσ itself
  for (let i = 0; i < n; i++) {
    // A sweep over hundreds of decades makes thousands of points: the deadline holds here too.
    if (deadline !== undefined && (i & 15) === 0 && performance.now() > deadline)
      throw new ComputeTimeExceededError();
    logP[i] = Math.log(pMin) + (i / (n - 1)) * (Math.log(pMax) - Math.log(pMin));
    const p = impedanceAt(
      kernel,
      [{ conductivitySPerM: Math.exp(logP[i]!), relativePermeability: 1, thicknessM }],
      f,
      l0,
    );
    re[i] = p.normalizedResistance;
    im[i] = p.normalizedReactance - 1;
  }
  return { logP, re, im };
}

/** Catmull–Rom interpolation of one of the curve's arrays at grid index i + t (ends clamped). */
function catmullRom(arr: Float64Array, n: number, i: number, t: number): number {
  const p0 = arr[Math.min(n - 1, Math.max(0, i - 1))]!;
  const p1 = arr[Math.min(n - 1, Math.max(0, i))]!;
  const p2 = arr[Math.min(n - 1, Math.max(0, i + 1))]!;
  const p3 = arr[Math.min(n - 1, Math.max(0, i + 2))]!;
  return (
    0.5 *
    (2 * p1 +
      (-p0 + p2) * t +
      (2 * p0 - 5 * p1 + 4 * p2 - p3) * t * t +
      (-p0 + 3 * p1 - 3 * p2 + p3) * t * t * t)
  );
}

/** Catmull–Rom interpolation of the curve at a fractional index. */
function curveAt(c: Curve, x: number): [number, number] {
  const n = c.re.length;
  const i = Math.min(n - 2, Math.max(0, Math.floor(x)));
  const t = x - i;
  return [catmullRom(c.re, n, i, t), catmullRom(c.im, n, i, t)];
}

/** Squared distance from the curve at fractional index x to (tRe, tIm). */
function distanceAt(c: Curve, x: number, tRe: number, tIm: number): number {
  const n = c.re.length;
  const i = Math.min(n - 2, Math.max(0, Math.floor(x)));
  const t = x - i;
  const re = catmullRom(c.re, n, i, t) - tRe;
  const im = catmullRom(c.im, n, i, t) - tIm;
  return re * re + im * im;
}

/** Golden-section search for the curve point nearest the target, on [lo, hi] in index units. */
function nearestOnCurve(
  c: Curve,
  tRe: number,
  tIm: number,
  lo: number,
  hi: number,
  tolerance = 1e-7,
): number {
  // distanceAt called directly, not through a closure made per call: this runs for every reading
  // of a sort plan.
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let x1 = b - g * (b - a);
  let x2 = a + g * (b - a);
  let f1 = distanceAt(c, x1, tRe, tIm);
  let f2 = distanceAt(c, x2, tRe, tIm);
  for (let k = 0; k < 60 && b - a > tolerance; k++) {
    if (f1 < f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - g * (b - a);
      f1 = distanceAt(c, x1, tRe, tIm);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + g * (b - a);
      f2 = distanceAt(c, x2, tRe, tIm);
    }
  }
  return (a + b) / 2;
}

/**
 * The conductivity of the homogeneous plate whose normalised ΔZ lies nearest (tRe, tIm) at
 * angular frequency ω: a scan of the curve's grid within the σ range an instrument reports
 * ({@link SIGMA_RANGE}), then a golden-section search between the neighbours of the best grid
 * point. Returns σ (S/m), the relative distance of the fit and the fractional grid index.
 */
export function fitOnReferenceCurve(
  curve: ReferenceCurve,
  omega: number,
  tRe: number,
  tIm: number,
  /** Golden-section stop, in grid steps (a grid step is 1/60 of a decade of σ). */
  tolerance = 1e-7,
): { apparentSPerM: number; fitResidual: number; index: number } {
  const n = curve.re.length;
  const first = curve.logP[0]!;
  const range = curve.logP[n - 1]! - first;
  // Only ωσ within this frequency's σ range may be chosen.
  const toIndex = (p: number) => ((Math.log(p) - first) / range) * (n - 1);
  let lo = Math.max(0, toIndex(omega * SIGMA_RANGE[0]));
  let hi = Math.min(n - 1, toIndex(omega * SIGMA_RANGE[1]));
  let best = Math.round(lo);
  let bestDist = Infinity;
  for (let i = Math.ceil(lo); i <= Math.floor(hi); i++) {
    const dd = (curve.re[i]! - tRe) ** 2 + (curve.im[i]! - tIm) ** 2;
    if (dd < bestDist) {
      bestDist = dd;
      best = i;
    }
  }
  lo = Math.max(lo, best - 1);
  hi = Math.min(hi, best + 1);
  const x = nearestOnCurve(curve, tRe, tIm, lo, hi, tolerance);
  const [fRe, fIm] = curveAt(curve, x);
  const logP = first + (x / (n - 1)) * range;
  return {
    apparentSPerM: Math.exp(logP) / omega,
    fitResidual: Math.hypot(fRe - tRe, fIm - tIm) / Math.hypot(tRe, tIm),
    index: x,
  };
}

export interface SweepOptions {
  /** Called after each frequency with the fraction done, for a progress bar. */
  onProgress?: (fraction: number) => void;
  /** Throws once performance.now() passes it, so a request cannot run unbounded. */
  deadline?: number;
}

export class ComputeTimeExceededError extends Error {
  constructor() {
    super(
      'the calculation exceeded its compute time limit: ask for fewer points, layers or filaments',
    );
    this.name = 'ComputeTimeExceededError';
  }
}

/**
 * Apparent conductivity of a layered blank at each frequency: the σ of a homogeneous,
 * non-magnetic plate of the same total thickness (or a half-space) that gives the nearest
 * normalised ΔZ with the same coil and lift-off, by least squares in the normalised impedance
 * plane; the way an instrument calibrated on homogeneous reference blocks reads it (ASTM E1004
 * practice; method after Dodd & Deeds 1968). It tends to the thickness-weighted mean at low
 * frequency and to the face layer at high frequency; `fitResidual` says how far the real stack
 * lies from any homogeneous plate (large for magnetic cores).
 */
export function apparentConductivitySweep(
  kernel: DoddDeedsKernel,
  layers: ConductorLayer[],
  frequenciesHz: number[],
  options: SweepOptions = {},
): ApparentConductivityPoint[] {
  const l0 = coilInAirInductance(kernel);
  const thickness =
    layers.at(-1)!.thicknessM === null ? null : layers.reduce((s, l) => s + (l.thicknessM ?? 0), 0);
  const omegas = frequenciesHz.map((f) => 2 * Math.PI * f);
  const pMin = Math.min(...omegas) * SIGMA_RANGE[0];
  const pMax = Math.max(...omegas) * SIGMA_RANGE[1];
  const curve = referenceCurve(kernel, thickness, pMin, pMax, l0, options.deadline);
  const points: ApparentConductivityPoint[] = [];
  for (const [index, frequencyHz] of frequenciesHz.entries()) {
    if (options.deadline !== undefined && performance.now() > options.deadline)
      throw new ComputeTimeExceededError();
    const omega = omegas[index]!;
    const stack = impedanceAt(kernel, layers, frequencyHz, l0);
    const tRe = stack.normalizedResistance;
    const tIm = stack.normalizedReactance - 1;
    const { apparentSPerM: apparent, fitResidual } = fitOnReferenceCurve(curve, omega, tRe, tIm);
    // The stack changes the coil's impedance by nothing a double holds (ΔZ = 0 at so low a
    // ωσ): no instrument reads it, and the fit's distance relative to it is 0/0.
    if (!Number.isFinite(fitResidual) || !Number.isFinite(apparent))
      throw new OutsideModelError(
        `/body/frequencies/${index}`,
        `at ${frequencyHz} Hz this stack changes the coil's impedance by too little to read (normalised ΔZ ${Math.hypot(tRe, tIm)}): raise the frequency`,
      );
    points.push({
      frequencyHz,
      apparentConductivitySPerM: apparent,
      fitResidual,
      normalizedResistance: stack.normalizedResistance,
      normalizedReactance: stack.normalizedReactance,
    });
    options.onProgress?.((index + 1) / frequenciesHz.length);
  }
  return points;
}

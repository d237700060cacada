import {
  ComputeTimeExceededError,
  fitOnReferenceCurve,
  referenceCurve,
  SIGMA_RANGE,
  type ReferenceCurve,
} from './apparent-conductivity';
import type { CoilGeometry } from './coil';
import {
  buildDoddDeedsKernel,
  coilInAirInductance,
  conductorIntegral,
  type ConductorLayer,
  type DoddDeedsKernel,
} from './dodd-deeds';
import { OutsideModelError } from './errors';
import { seededUniform } from './random';
import { MAGNETIC_FROM_MU_R } from './warnings';

/**
 * The Sort Planner's engine: for each product a line sees, the window of readings an instrument
 * calibrated on solid non-magnetic blocks reports at each frequency, given the spread of lift-off,
 * temperature, the table's conductivity range and the plating thickness; then where the windows
 * overlap and which frequency (or pair of frequencies) keeps them apart.
 *
 * Conventions (stated in openapi.yaml too):
 * - A reading is the apparent conductivity of Layer Lab ({@link fitOnReferenceCurve}): the σ of
 *   the homogeneous non-magnetic plate of the product's nominal total thickness (a half-space for
 *   a solid alloy) whose normalised ΔZ lies nearest the piece's, the reference curve computed at
 *   the calibration lift-off, which is the middle of the lift-off range. A piece at another
 *   lift-off moves the reading, as it does on a real instrument.
 * - Temperature acts through each layer's temperature coefficient of resistivity:
 *   σ(T) = σ_ref / (1 + α·(T − T_ref)).
 * - Plating layers are every layer but the core (the thickest); their thickness varies by the
 *   plating tolerance, all together, the core unchanged.
 * - Uniform distributions within every range (the table's min–max says nothing of a
 *   distribution): Monte Carlo windows are the smallest and largest sampled readings.
 */

/** A material as the plan uses it: the table's range and coefficient, SI. */
export interface PlanMaterial {
  /** The alloy's slug, or a description of a conductivity given in the request. */
  label: string;
  /** At the reference temperature, S/m. */
  conductivity: { nominal: number; min: number; max: number };
  referenceTemperatureK: number;
  /** Temperature coefficient of resistivity at the reference temperature, 1/K, with bounds. */
  alpha: { nominal: number; low: number; high: number };
  relativePermeability: number;
}

export interface PlanProduct {
  name: string;
  /** From the face toward the coil; `material` indexes PlanInput.materials; null: half-space (last only). */
  layers: Array<{ material: number; thicknessM: number | null }>;
}

export type PlanMethod =
  { kind: 'interval' } | { kind: 'monteCarlo'; samples: number; seed: number };

export interface PlanInput {
  coil: CoilGeometry;
  frequenciesHz: number[];
  liftOffM: { min: number; max: number };
  temperatureK: { min: number; max: number };
  /** ± fraction of the plating layers' thickness (0.1 for ±10 %). */
  platingTolerance: number;
  materials: PlanMaterial[];
  products: PlanProduct[];
  method: PlanMethod;
}

export type PlanWarningCode =
  | 'magnetic-layer'
  | 'non-monotone'
  | 'inseparable'
  | 'blank-edge'
  | 'no-temperature-coefficient'
  | 'no-conductivity-range'
  | 'unreleased-table';

export interface PlanWarning {
  code: PlanWarningCode;
  message: string;
}

export interface PlanWindow {
  product: string;
  lowSPerM: number;
  highSPerM: number;
  lowPercentIacs: number;
  highPercentIacs: number;
  /** Normalised impedance: ΔR/X0 and X/X0, X0 = ωL0 of the coil in air. */
  impedance: { resistance: [number, number]; reactance: [number, number] };
}

export interface PlanOverlap {
  a: string;
  b: string;
  fraction: number;
}

export interface PlanFrequency {
  frequencyHz: number;
  windows: PlanWindow[];
  overlaps: PlanOverlap[];
  separability: number | null;
}

export interface PlanResult {
  frequencies: PlanFrequency[];
  recommendedFrequencyHz: number | null;
  recommendedPair: [number, number] | null;
  warnings: PlanWarning[];
}

export interface PlanOptions {
  /** performance.now() after which the plan gives up (ComputeTimeExceededError). */
  deadline?: number;
  /** Fraction done, for a progress bar. */
  onProgress?: (fraction: number) => void;
  /** Dodd–Deeds kernels by coil and lift-off (the server's cache); built afresh without one. */
  kernelFor?: (coil: CoilGeometry, liftOffM: number, options: PlanKernelOptions) => DoddDeedsKernel;
}

/** 100 %IACS, S/m (IEC 60028). */
const IACS_100 = 58e6;

/**
 * Quadrature of the plan's kernel: Gauss–Legendre of order 6 on panels half as dense as Layer
 * Lab's, then cut where the rest of Σ|w| falls below 1e-8 of the whole (|R| ≤ 1, so the cut
 * bounds the error). Readings agree with Layer Lab's to about 1e-5 (tests/unit/physics/
 * sort-plan.test.ts allows 2e-5) with about 60–150 nodes instead of 500–1100: table ranges and
 * tolerances move readings by percent.
 */
export const PLAN_KERNEL = { refine: 0.25, order: 6 } as const;
export type PlanKernelOptions = typeof PLAN_KERNEL;
const TAIL_TOLERANCE = 1e-8;

/**
 * The coil's part of the conductor term once for all lift-offs: lift-off ℓ enters the
 * Dodd–Deeds integrand only as (e^{−αℓ} − e^{−α(ℓ+h)})² = e^{−2αℓ}(1 − e^{−αh})², so the weights
 * at any ℓ ≥ ℓmin are these base weights times e^{−2αℓ} (physics.md, sort windows).
 */
export interface PlanKernel {
  alphas: Float64Array;
  /** w·P²/α⁶·(1 − e^{−αh})²: conductor weights without the lift-off factor. */
  baseWeights: Float64Array;
  airWeights: Float64Array;
  count: number;
  scale: number;
  inductanceInAirH: number;
}

export function planKernel(kernel: DoddDeedsKernel, liftOffMinM: number): PlanKernel {
  let total = 0;
  for (let i = 0; i < kernel.conductorNodes; i++) total += Math.abs(kernel.conductorWeights[i]!);
  let count = kernel.conductorNodes;
  let tail = 0;
  while (count > 1 && tail + Math.abs(kernel.conductorWeights[count - 1]!) < TAIL_TOLERANCE * total)
    tail += Math.abs(kernel.conductorWeights[--count]!);
  const baseWeights = new Float64Array(count);
  for (let i = 0; i < count; i++)
    baseWeights[i] = kernel.conductorWeights[i]! * Math.exp(2 * kernel.alphas[i]! * liftOffMinM);
  return {
    alphas: kernel.alphas.subarray(0, count),
    baseWeights,
    airWeights: kernel.airWeights,
    count,
    scale: kernel.scale,
    inductanceInAirH: coilInAirInductance(kernel),
  };
}

/** The conductor weights at lift-off ℓ: base weights × e^{−2αℓ}. */
export function weightsAt(kernel: PlanKernel, liftOffM: number): Float64Array {
  const w = new Float64Array(kernel.count);
  for (let i = 0; i < kernel.count; i++)
    w[i] = kernel.baseWeights[i]! * Math.exp(-2 * kernel.alphas[i]! * liftOffM);
  return w;
}

/** One state of a piece: its temperature, each material's σ there, plating factor, lift-off. */
interface PieceState {
  sigmas: number[];
  platingFactor: number;
  liftOffM: number;
}

interface ProductModel {
  product: PlanProduct;
  /** Materials the product uses (indexes into PlanInput.materials). */
  materials: number[];
  core: number;
  curve: ReferenceCurve;
}

/** σ of material m at temperature T for a given room-temperature σ and coefficient. */
function sigmaAt(m: PlanMaterial, sigmaRef: number, alpha: number, temperatureK: number): number {
  const factor = 1 + alpha * (temperatureK - m.referenceTemperatureK);
  if (!(factor > 0.05))
    throw new OutsideModelError(
      '/body/temperature',
      `at ${Number((temperatureK - 273.15).toPrecision(4))} °C the linear temperature coefficient of ${m.label} (${alpha} /K) leaves no resistivity: keep the temperature range near room temperature`,
    );
  return sigmaRef / factor;
}

/** The lowest, nominal or highest σ of a material at T, over its conductivity and α ranges. */
function sigmaSide(m: PlanMaterial, side: -1 | 0 | 1, temperatureK: number): number {
  if (side === 0) return sigmaAt(m, m.conductivity.nominal, m.alpha.nominal, temperatureK);
  const ref = side < 0 ? m.conductivity.min : m.conductivity.max;
  const a = sigmaAt(m, ref, m.alpha.low, temperatureK);
  const b = sigmaAt(m, ref, m.alpha.high, temperatureK);
  return side < 0 ? Math.min(a, b) : Math.max(a, b);
}

function layersOf(model: ProductModel, input: PlanInput, state: PieceState): ConductorLayer[] {
  return model.product.layers.map((l, k) => ({
    conductivitySPerM: state.sigmas[l.material]!,
    relativePermeability: input.materials[l.material]!.relativePermeability,
    thicknessM:
      l.thicknessM === null
        ? null
        : k === model.core
          ? l.thicknessM
          : l.thicknessM * state.platingFactor,
  }));
}

interface Reading {
  sigma: number;
  resistance: number;
  reactance: number;
}

/** The fit's stop in grid steps: 1e-5 of 1/60 decade, a few parts in 1e7 of the reading. */
const FIT_TOLERANCE = 1e-5;

function readAt(
  kernel: PlanKernel,
  weights: Float64Array,
  curve: ReferenceCurve,
  layers: ConductorLayer[],
  frequencyHz: number,
  frequencyIndex: number,
): Reading {
  const omega = 2 * Math.PI * frequencyHz;
  const [iRe, iIm] = conductorIntegral(kernel.alphas, weights, kernel.count, layers, omega);
  const resistance = (-kernel.scale * iIm) / kernel.inductanceInAirH;
  const deltaX = (kernel.scale * iRe) / kernel.inductanceInAirH;
  // The whole curve is scanned for every reading: a plate of finite thickness gives a curve that
  // bends back near itself, and a search started from the nominal reading's neighbourhood can
  // settle on the wrong branch (it moved some windows by two thirds when tried).
  const fit = fitOnReferenceCurve(curve, omega, resistance, deltaX, FIT_TOLERANCE);
  if (!Number.isFinite(fit.apparentSPerM) || !Number.isFinite(fit.fitResidual))
    throw new OutsideModelError(
      `/body/frequencies/${frequencyIndex}`,
      `at ${frequencyHz} Hz a product changes the coil's impedance by too little to read: raise the frequency`,
    );
  return { sigma: fit.apparentSPerM, resistance, reactance: 1 + deltaX };
}

/** Running extremes of the readings of one product at one frequency. */
class Extent {
  lo = Infinity;
  hi = -Infinity;
  rLo = Infinity;
  rHi = -Infinity;
  xLo = Infinity;
  xHi = -Infinity;
  add(r: Reading) {
    this.lo = Math.min(this.lo, r.sigma);
    this.hi = Math.max(this.hi, r.sigma);
    this.rLo = Math.min(this.rLo, r.resistance);
    this.rHi = Math.max(this.rHi, r.resistance);
    this.xLo = Math.min(this.xLo, r.reactance);
    this.xHi = Math.max(this.xHi, r.reactance);
  }
}

/** The parameters of a product's tolerance box that actually vary. */
type Parameter =
  | { kind: 'temperature' }
  | { kind: 'material'; material: number }
  | { kind: 'plating' }
  | { kind: 'liftOff' };

function parameterName(p: Parameter, input: PlanInput): string {
  if (p.kind === 'material') return `the conductivity of ${input.materials[p.material]!.label}`;
  if (p.kind === 'plating') return 'the plating thickness';
  if (p.kind === 'liftOff') return 'the lift-off';
  return 'the temperature';
}

/**
 * A box corner or edge point: each parameter at −1 (its low end), 0 (nominal) or +1 (high end).
 * Temperature: the range's ends and middle; a material: {@link sigmaSide} at that temperature.
 */
function stateAt(
  model: ProductModel,
  input: PlanInput,
  sides: Map<Parameter, -1 | 0 | 1>,
  params: Parameter[],
): PieceState {
  const side = (p: Parameter | undefined) => (p ? (sides.get(p) ?? 0) : 0);
  const tParam = params.find((p) => p.kind === 'temperature');
  const { min: tMin, max: tMax } = input.temperatureK;
  const t = [tMin, (tMin + tMax) / 2, tMax][side(tParam) + 1]!;
  const sigmas: number[] = [];
  for (const m of model.materials) {
    const p = params.find((q) => q.kind === 'material' && q.material === m);
    sigmas[m] = sigmaSide(input.materials[m]!, side(p), t);
  }
  const tol = input.platingTolerance;
  const { min: lMin, max: lMax } = input.liftOffM;
  return {
    sigmas,
    platingFactor: 1 + tol * side(params.find((p) => p.kind === 'plating')),
    liftOffM: [lMin, (lMin + lMax) / 2, lMax][side(params.find((p) => p.kind === 'liftOff')) + 1]!,
  };
}

function varyingParameters(model: ProductModel, input: PlanInput): Parameter[] {
  const params: Parameter[] = [];
  if (input.temperatureK.max > input.temperatureK.min) params.push({ kind: 'temperature' });
  for (const m of model.materials) {
    const mat = input.materials[m]!;
    const tempSpread = input.temperatureK.max > input.temperatureK.min;
    if (
      mat.conductivity.max > mat.conductivity.min ||
      (mat.alpha.high > mat.alpha.low &&
        (tempSpread || input.temperatureK.min !== mat.referenceTemperatureK))
    )
      params.push({ kind: 'material', material: m });
  }
  if (input.platingTolerance > 0 && model.product.layers.length > 1)
    params.push({ kind: 'plating' });
  if (input.liftOffM.max > input.liftOffM.min) params.push({ kind: 'liftOff' });
  return params;
}

/** A frequency for a sentence: 10 kHz, 1.58 MHz, 630 Hz (four significant figures at most). */
function hertzText(hz: number): string {
  const [scale, unit] = hz >= 1e6 ? [1e6, 'MHz'] : hz >= 1e3 ? [1e3, 'kHz'] : [1, 'Hz'];
  return `${Number((hz / scale).toPrecision(4))} ${unit}`;
}

/**
 * Evaluates a sort plan (see the module's conventions above). Per frequency and product the
 * window of readings; per frequency the overlapping pairs and the separability; the frequency of
 * the largest separability; and the pair of frequencies whose joint windows (a box per product
 * in the plane of the two readings) keep the most pairs of products apart.
 *
 * Cost: one Dodd–Deeds conductor integral per piece state and frequency on a kernel built once
 * per coil; lift-off scales the kernel's weights by e^{−2αℓ} once per state; layers under an
 * opaque one are skipped. The interval method evaluates the corners of the tolerance box (2ⁿ
 * states for n varying parameters) and checks each parameter for monotonicity at the nominal
 * point (warning `non-monotone` where the middle of a range reads outside its ends, since corners
 * then understate the window); Monte Carlo evaluates `samples` states drawn uniformly with
 * xoshiro128** from the seed.
 */
export function evaluateSortPlan(input: PlanInput, options: PlanOptions = {}): PlanResult {
  const { deadline } = options;
  const check = () => {
    if (deadline !== undefined && performance.now() > deadline)
      throw new ComputeTimeExceededError();
  };
  const build = options.kernelFor ?? ((coil, l, o) => buildDoddDeedsKernel(coil, l, o));
  const kernel = planKernel(build(input.coil, input.liftOffM.min, PLAN_KERNEL), input.liftOffM.min);
  const calibrationLiftOff = (input.liftOffM.min + input.liftOffM.max) / 2;
  const calibrationWeights = weightsAt(kernel, calibrationLiftOff);
  const calibrationKernel: DoddDeedsKernel = {
    alphas: kernel.alphas,
    airWeights: kernel.airWeights,
    conductorWeights: calibrationWeights,
    conductorNodes: kernel.count,
    scale: kernel.scale,
  };
  const freqs = input.frequenciesHz;
  const omegas = freqs.map((f) => 2 * Math.PI * f);
  const pMin = Math.min(...omegas) * SIGMA_RANGE[0];
  const pMax = Math.max(...omegas) * SIGMA_RANGE[1];
  const warnings: PlanWarning[] = [];

  const models: ProductModel[] = input.products.map((product) => {
    check();
    const materials = [...new Set(product.layers.map((l) => l.material))];
    let core = 0;
    product.layers.forEach((l, k) => {
      const c = product.layers[core]!.thicknessM;
      if (l.thicknessM === null || (c !== null && l.thicknessM > c)) core = k;
    });
    const halfSpace = product.layers.at(-1)!.thicknessM === null;
    const thickness = halfSpace ? null : product.layers.reduce((s, l) => s + l.thicknessM!, 0);
    const curve = referenceCurve(
      calibrationKernel,
      thickness,
      pMin,
      pMax,
      kernel.inductanceInAirH,
      deadline,
    );
    const muR = Math.max(
      ...product.layers.map((l) => input.materials[l.material]!.relativePermeability),
    );
    if (muR > MAGNETIC_FROM_MU_R)
      warnings.push({
        code: 'magnetic-layer',
        message: `${product.name} has a magnetic layer (µr up to ${Number(muR.toPrecision(3))}): its reading against non-magnetic calibration blocks is the nearest non-magnetic plate to an impedance no such plate gives, so its window is only a guide. A magnetic piece moves the impedance in a direction of its own, which an instrument can use to tell it apart.`,
      });
    return { product, materials, core, curve };
  });

  const extents = models.map(() => freqs.map(() => new Extent()));
  const method = input.method;
  const statesPerProduct = method.kind === 'interval' ? 0 : method.samples;
  let done = 0;
  const totalWork = models.length;

  models.forEach((model, p) => {
    const params = varyingParameters(model, input);
    const evaluate = (state: PieceState, record: boolean): Reading[] => {
      check();
      const w = weightsAt(kernel, state.liftOffM);
      const layers = layersOf(model, input, state);
      return freqs.map((f, i) => {
        const r = readAt(kernel, w, model.curve, layers, f, i);
        if (record) extents[p]![i]!.add(r);
        return r;
      });
    };
    // The nominal piece: the middle of each range, for the monotonicity check.
    const nominal =
      method.kind === 'interval' ? evaluate(stateAt(model, input, new Map(), params), false) : [];

    if (method.kind === 'interval') {
      for (let corner = 0; corner < 1 << params.length; corner++) {
        const sides = new Map<Parameter, -1 | 0 | 1>(
          params.map((q, b) => [q, (corner >> b) & 1 ? 1 : -1]),
        );
        evaluate(stateAt(model, input, sides, params), true);
      }
      if (params.length === 0) nominal.forEach((r, i) => extents[p]![i]!.add(r));
      // Monotonicity along each parameter through the nominal point.
      for (const q of params) {
        const lo = evaluate(stateAt(model, input, new Map([[q, -1]]), params), false);
        const hi = evaluate(stateAt(model, input, new Map([[q, 1]]), params), false);
        const bad = freqs.filter((_, i) => {
          const a = Math.min(lo[i]!.sigma, hi[i]!.sigma);
          const b = Math.max(lo[i]!.sigma, hi[i]!.sigma);
          const m = nominal[i]!.sigma;
          const slack = 1e-6 * Math.abs(m);
          return m < a - slack || m > b + slack;
        });
        if (bad.length > 0)
          warnings.push({
            code: 'non-monotone',
            message: `${model.product.name}'s reading does not change monotonically with ${parameterName(q, input)} at ${bad.length} of ${freqs.length} frequencies (first at ${Number(bad[0]!.toPrecision(4))} Hz): the interval window there comes from the corners of the ranges and may be too narrow. Use the monteCarlo method for these frequencies.`,
          });
      }
    } else {
      const next = seededUniform((method.seed + Math.imul(p + 1, 0x9e3779b9)) >>> 0);
      const { min: tMin, max: tMax } = input.temperatureK;
      const { min: lMin, max: lMax } = input.liftOffM;
      for (let s = 0; s < statesPerProduct; s++) {
        const t = tMin + next() * (tMax - tMin);
        const sigmas: number[] = [];
        for (const m of model.materials) {
          const mat = input.materials[m]!;
          const ref = mat.conductivity.min + next() * (mat.conductivity.max - mat.conductivity.min);
          const alpha = mat.alpha.low + next() * (mat.alpha.high - mat.alpha.low);
          sigmas[m] = sigmaAt(mat, ref, alpha, t);
        }
        const platingFactor = 1 + input.platingTolerance * (2 * next() - 1);
        const liftOffM = lMin + next() * (lMax - lMin);
        evaluate({ sigmas, platingFactor, liftOffM }, true);
        if ((s & 31) === 31) options.onProgress?.((done + s / statesPerProduct) / totalWork);
      }
    }
    done++;
    options.onProgress?.(done / totalWork);
  });

  const frequencies: PlanFrequency[] = freqs.map((frequencyHz, i) => {
    const windows = models.map((model, p) => {
      const e = extents[p]![i]!;
      return {
        product: model.product.name,
        lowSPerM: e.lo,
        highSPerM: e.hi,
        lowPercentIacs: (e.lo / IACS_100) * 100,
        highPercentIacs: (e.hi / IACS_100) * 100,
        impedance: {
          resistance: [e.rLo, e.rHi] as [number, number],
          reactance: [e.xLo, e.xHi] as [number, number],
        },
      };
    });
    return {
      frequencyHz,
      windows,
      overlaps: overlapsOf(windows),
      separability: separability(windows),
    };
  });

  const recommendedFrequencyHz = bestFrequency(frequencies);
  const recommendedPair = bestPair(frequencies, models.length);
  if (recommendedFrequencyHz !== null) {
    const at = frequencies.find((f) => f.frequencyHz === recommendedFrequencyHz)!;
    if (at.overlaps.length > 0) {
      const pairText = recommendedPair
        ? (() => {
            const left = unseparatedByPair(frequencies, recommendedPair);
            return left.length === 0
              ? ` The pair ${recommendedPair.map(hertzText).join(' and ')} separates every product.`
              : ` Even the pair ${recommendedPair.map(hertzText).join(' and ')} leaves ${left.map(([a, b]) => `${a} / ${b}`).join(', ')} overlapping.`;
          })()
        : '';
      warnings.push({
        code: 'inseparable',
        message: `At the recommended ${hertzText(recommendedFrequencyHz)} these windows still overlap: ${at.overlaps.map((o) => `${o.a} / ${o.b}`).join(', ')}.${pairText}`,
      });
    }
  }
  return { frequencies, recommendedFrequencyHz, recommendedPair, warnings };
}

/**
 * Pairs of products whose windows share readings: `fraction` is the shared length over the
 * narrower window's width (1 when one window holds the other; a window of no width counts as 1
 * when it lies inside the other). Disjoint and merely touching windows are not listed.
 */
export function overlapsOf(windows: PlanWindow[]): PlanOverlap[] {
  const out: PlanOverlap[] = [];
  for (let a = 0; a < windows.length; a++) {
    for (let b = a + 1; b < windows.length; b++) {
      const A = windows[a]!;
      const B = windows[b]!;
      const shared = Math.min(A.highSPerM, B.highSPerM) - Math.max(A.lowSPerM, B.lowSPerM);
      const narrow = Math.min(A.highSPerM - A.lowSPerM, B.highSPerM - B.lowSPerM);
      if (shared < 0 || (shared === 0 && narrow > 0)) continue;
      out.push({ a: A.product, b: B.product, fraction: narrow > 0 ? shared / narrow : 1 });
    }
  }
  return out;
}

/**
 * Separability of a set of windows: order them by their centres; for each neighbouring pair take
 * the gap between them (the upper one's low end minus the lower one's high end) in units of their
 * mean width; the smallest of these. Above 0 every window stands apart, and 1 means the closest
 * two are one window-width apart; 0 means two touch; below 0 two overlap (−1: one sits inside a
 * neighbour of the same width). Widths below a millionth of the larger reading count as that
 * millionth, so the score stays finite. Null for fewer than two windows.
 */
export function separability(windows: PlanWindow[]): number | null {
  if (windows.length < 2) return null;
  const sorted = [...windows].sort((a, b) => a.lowSPerM + a.highSPerM - (b.lowSPerM + b.highSPerM));
  let least = Infinity;
  for (let i = 0; i + 1 < sorted.length; i++) {
    least = Math.min(least, normalisedGap(sorted[i]!, sorted[i + 1]!));
  }
  return least;
}

/** The gap from window a (lower) to window b (upper) in units of their mean width. */
function normalisedGap(a: PlanWindow, b: PlanWindow): number {
  const mean = (a.highSPerM - a.lowSPerM + (b.highSPerM - b.lowSPerM)) / 2;
  const floor = 1e-6 * Math.max(Math.abs(a.highSPerM), Math.abs(b.highSPerM));
  return (b.lowSPerM - a.highSPerM) / Math.max(mean, floor);
}

/** The gap between two windows whichever is higher, in units of their mean width. */
function gapBetween(a: PlanWindow, b: PlanWindow): number {
  return a.lowSPerM + a.highSPerM <= b.lowSPerM + b.highSPerM
    ? normalisedGap(a, b)
    : normalisedGap(b, a);
}

/** The frequency of the largest separability; the lowest of equals. */
function bestFrequency(frequencies: PlanFrequency[]): number | null {
  let best: PlanFrequency | null = null;
  for (const f of frequencies) {
    if (f.separability === null) continue;
    if (!best || f.separability > best.separability! + 1e-12) best = f;
  }
  return best?.frequencyHz ?? null;
}

function unseparatedByPair(
  frequencies: PlanFrequency[],
  pair: [number, number],
): Array<[string, string]> {
  const [fa, fb] = pair.map((f) => frequencies.find((x) => x.frequencyHz === f)!);
  const left: Array<[string, string]> = [];
  const n = fa!.windows.length;
  for (let a = 0; a < n; a++)
    for (let b = a + 1; b < n; b++) {
      if (
        gapBetween(fa!.windows[a]!, fa!.windows[b]!) <= 0 &&
        gapBetween(fb!.windows[a]!, fb!.windows[b]!) <= 0
      )
        left.push([fa!.windows[a]!.product, fa!.windows[b]!.product]);
    }
  return left;
}

/**
 * The two frequencies whose joint windows keep the most pairs of products apart: each product is
 * a box (its window at the first frequency × its window at the second), and two products are apart
 * when their boxes do not meet, that is when their windows are disjoint at either frequency. Among
 * pairs that separate as many, the one whose closest pair of products is farthest apart (the
 * larger of its two normalised gaps). Null for fewer than two frequencies or products.
 */
function bestPair(frequencies: PlanFrequency[], products: number): [number, number] | null {
  if (frequencies.length < 2 || products < 2) return null;
  let best: { count: number; margin: number; pair: [number, number] } | null = null;
  for (let i = 0; i < frequencies.length; i++) {
    for (let j = i + 1; j < frequencies.length; j++) {
      const A = frequencies[i]!.windows;
      const B = frequencies[j]!.windows;
      let count = 0;
      let margin = Infinity;
      for (let a = 0; a < products; a++)
        for (let b = a + 1; b < products; b++) {
          const g = Math.max(gapBetween(A[a]!, A[b]!), gapBetween(B[a]!, B[b]!));
          if (g > 0) count++;
          margin = Math.min(margin, g);
        }
      if (!best || count > best.count || (count === best.count && margin > best.margin + 1e-12))
        best = { count, margin, pair: [frequencies[i]!.frequencyHz, frequencies[j]!.frequencyHz] };
    }
  }
  return best!.pair;
}

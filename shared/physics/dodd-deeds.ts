import besselj1 from '@stdlib/math-base-special-besselj1';
import { MU0 } from './constants';
import type { CoilGeometry } from './coil';
import { gaussLegendre } from './gauss-legendre';

/**
 * One conductor layer under the coil: σ, µr and a thickness, or `thicknessM: null` for a
 * half-space (only as the last layer). Layers are listed from the face toward the coil downward.
 */
export interface ConductorLayer {
  conductivitySPerM: number;
  relativePermeability: number;
  thicknessM: number | null;
}

/**
 * The frequency-independent part of the Dodd–Deeds integral for one coil at one lift-off:
 * quadrature nodes α with their weights times P(α)²/α⁶ and the geometric factors, so that a
 * frequency sweep only evaluates the layer reflection R(α) at each node.
 */
export interface DoddDeedsKernel {
  alphas: Float64Array;
  /** w·P²/α⁶·2[αh + e^{−αh} − 1]: the coil in air. */
  airWeights: Float64Array;
  /** w·P²/α⁶·(e^{−αl1} − e^{−αl2})²: the coupling to the conductor. */
  conductorWeights: Float64Array;
  /** Number of nodes that carry the conductor term (it dies off as e^{−2αl1}). */
  conductorNodes: number;
  /** πµ0N²/[h²(r2 − r1)²]. */
  scale: number;
}

export interface KernelOptions {
  /** Gauss–Legendre order per panel. */
  order?: number;
  /** Panels are refined by this factor (2 doubles them), for convergence checks. */
  refine?: number;
}

/**
 * F(X) = ∫₀^X x·J1(x) dx at many X at once: the values sorted, integrated piecewise between
 * neighbours with 8-point Gauss–Legendre (pieces no longer than 1, where x·J1 is a low
 * polynomial to machine precision), and summed. Avoids the Struve closed form, which @stdlib
 * does not provide.
 */
function integralXJ1(xs: Float64Array): Float64Array {
  const order = [...xs.keys()].sort((i, j) => xs[i]! - xs[j]!);
  const { nodes, weights } = gaussLegendre(8);
  const out = new Float64Array(xs.length);
  let x0 = 0;
  let acc = 0;
  for (const index of order) {
    const x1 = xs[index]!;
    const pieces = Math.max(1, Math.ceil(x1 - x0));
    const width = (x1 - x0) / pieces;
    for (let p = 0; p < pieces; p++) {
      const a = x0 + p * width;
      const half = width / 2;
      for (let k = 0; k < 8; k++) {
        const x = a + half * (1 + nodes[k]!);
        acc += half * weights[k]! * x * besselj1(x);
      }
    }
    out[index] = acc;
    x0 = x1;
  }
  return out;
}

/** Panel edges in α: geometric near zero, then linear at a quarter of the shortest oscillation. */
function panelEdges(coil: CoilGeometry, refine: number): number[] {
  const r1 = coil.innerRadiusM;
  const r2 = coil.outerRadiusM;
  const linearStep = Math.PI / (2 * r2) / refine;
  const alphaMax = 400 / Math.max(r1, 0.05 * r2);
  const edges = [0, 0.02 / r2];
  const ratio = 1 + 0.25 / refine;
  while (edges.at(-1)! * (ratio - 1) < linearStep) edges.push(edges.at(-1)! * ratio);
  while (edges.at(-1)! < alphaMax) edges.push(edges.at(-1)! + linearStep);
  return edges;
}

/**
 * Builds the kernel of Dodd & Deeds (J. Appl. Phys. 39, 2829, 1968) for an axisymmetric air-core
 * coil (radii r1, r2, length h, N turns) whose face is at lift-off l1 above the conductor:
 * Z = jω·πµ0N²/[h²(r2 − r1)²] ∫₀^∞ P(α)²/α⁶ {2[αh + e^{−αh} − 1] + (e^{−αl1} − e^{−αl2})²·R(α)} dα,
 * P(α) = ∫_{αr1}^{αr2} x·J1(x) dx, l2 = l1 + h. Integrated with Gauss–Legendre on panels up to
 * α = 400/r1; the tail beyond falls as α⁻⁴ (air) and α⁻⁵·e^{−2αl1} (conductor).
 */
export function buildDoddDeedsKernel(
  coil: CoilGeometry,
  liftOffM: number,
  options: KernelOptions = {},
): DoddDeedsKernel {
  const order = options.order ?? 8;
  // Half the default panel density already agrees with twice it to 12 digits on TEAM 15-1.
  const refine = options.refine ?? 0.5;
  const { nodes, weights } = gaussLegendre(order);
  const edges = panelEdges(coil, refine);
  const count = (edges.length - 1) * order;
  const alphas = new Float64Array(count);
  const w = new Float64Array(count);
  for (let p = 0; p < edges.length - 1; p++) {
    const a = edges[p]!;
    const half = (edges[p + 1]! - a) / 2;
    for (let k = 0; k < order; k++) {
      alphas[p * order + k] = a + half * (1 + nodes[k]!);
      w[p * order + k] = half * weights[k]!;
    }
  }
  const { innerRadiusM: r1, outerRadiusM: r2, lengthM: h, turns } = coil;
  const xs = new Float64Array(2 * count);
  for (let i = 0; i < count; i++) {
    xs[2 * i] = alphas[i]! * r1;
    xs[2 * i + 1] = alphas[i]! * r2;
  }
  const F = integralXJ1(xs);
  const airWeights = new Float64Array(count);
  const conductorWeights = new Float64Array(count);
  const l1 = liftOffM;
  const l2 = liftOffM + h;
  let conductorNodes = count;
  for (let i = 0; i < count; i++) {
    const alpha = alphas[i]!;
    const P = F[2 * i + 1]! - F[2 * i]!;
    const p2a6 = (P * P) / alpha ** 6;
    const ah = alpha * h;
    // 2[αh + e^{−αh} − 1] loses every digit for small αh; its series is (αh)² − (αh)³/3 + …
    const air = ah < 1e-3 ? ah * ah * (1 - ah / 3 + (ah * ah) / 12) : 2 * (ah + Math.exp(-ah) - 1);
    airWeights[i] = w[i]! * p2a6 * air;
    const coupling = Math.exp(-alpha * l1) - Math.exp(-alpha * l2);
    conductorWeights[i] = w[i]! * p2a6 * coupling * coupling;
    if (conductorNodes === count && alpha * l1 > 18 && i % order === 0) conductorNodes = i;
  }
  return {
    alphas,
    airWeights,
    conductorWeights,
    conductorNodes,
    scale: (Math.PI * MU0 * turns * turns) / (h * h * (r2 - r1) ** 2),
  };
}

/** Inductance of the coil in air, H: the air term of the kernel. */
export function coilInAirInductance(kernel: DoddDeedsKernel): number {
  let sum = 0;
  for (let i = 0; i < kernel.airWeights.length; i++) sum += kernel.airWeights[i]!;
  return kernel.scale * sum;
}

/**
 * ∫ conductorWeights·R(α) dα for the layered conductor at angular frequency ω, as [re, im].
 * R = (α − Y)/(α + Y) with Y from the layer recursion of physics.md (Dodd & Deeds' transfer
 * form): Y starts as α (air below) or β_N (half-space), and for each layer going up
 * Y ← β(Y + βt)/(β + Yt), with α_k = √(α² + jωµ0µ_kσ_k), β_k = α_k/µ_k, t = tanh(α_k d_k).
 */
function reflectionIntegral(
  kernel: DoddDeedsKernel,
  layers: ConductorLayer[],
  omega: number,
): [number, number] {
  return conductorIntegral(
    kernel.alphas,
    kernel.conductorWeights,
    kernel.conductorNodes,
    layers,
    omega,
  );
}

/**
 * Re(α_k·d_k) beyond which tanh(α_k d_k) is 1 to the last bit of a double (e^{−2x} < 2⁻⁵³ from
 * x ≈ 18.4): the layer then hides everything under it, and the recursion may start at its top
 * with Y = β_k, as if it were a half-space.
 */
const OPAQUE_LAYER = 19;

/**
 * |α_k d_k| below which tanh is summed from its Taylor series to z⁹ (the next term is below
 * 1e-12 of the sum there), sparing the exponential and the sine and cosine for thin platings.
 */
const THIN_LAYER = 0.1;

/** Re(α_k·d) ≥ √(ωµ0µσ/2)·d for every α: true when the layer is opaque at every node. */
function opaqueAtEveryNode(layer: ConductorLayer, omega: number): boolean {
  return (
    layer.thicknessM === null ||
    Math.sqrt((omega * MU0 * layer.relativePermeability * layer.conductivitySPerM) / 2) *
      layer.thicknessM >=
      OPAQUE_LAYER
  );
}

/**
 * Σᵢ wᵢ·R(αᵢ) over the first `count` nodes: the conductor's part of the Dodd–Deeds integral
 * with weights of the caller's choosing (the Sort Planner scales them by e^{−2αℓ} for each
 * lift-off sample). Written out in real arithmetic with no allocation: this loop is the cost of
 * every frequency point. Layers under one that is opaque at ω at every node (Re α_k ≥
 * √(ωµ0µσ/2)) are skipped: they change nothing a double can hold.
 */
export function conductorIntegral(
  alphas: Float64Array,
  weights: Float64Array,
  count: number,
  layers: ConductorLayer[],
  omega: number,
): [number, number] {
  let bottom = layers.length - 1;
  for (let k = 0; k < layers.length; k++) {
    if (opaqueAtEveryNode(layers[k]!, omega)) {
      bottom = k;
      break;
    }
  }
  const last = layers[bottom]!;
  const halfSpace = opaqueAtEveryNode(last, omega);
  const finite = halfSpace ? bottom : bottom + 1;
  const lastB = omega * MU0 * last.relativePermeability * last.conductivitySPerM;
  const lastMu = last.relativePermeability;
  let sumRe = 0;
  let sumIm = 0;
  for (let i = 0; i < count; i++) {
    const alpha = alphas[i]!;
    const a2 = alpha * alpha;
    let yRe: number;
    let yIm: number;
    if (halfSpace) {
      const m = Math.sqrt(a2 * a2 + lastB * lastB);
      yRe = Math.sqrt((m + a2) / 2) / lastMu;
      yIm = Math.sqrt(Math.max(0, (m - a2) / 2)) / lastMu;
    } else {
      yRe = alpha;
      yIm = 0;
    }
    for (let k = finite - 1; k >= 0; k--) {
      const layer = layers[k]!;
      const mu = layer.relativePermeability;
      const b = omega * MU0 * mu * layer.conductivitySPerM;
      // α_k = √(α² + jb), principal root
      const m = Math.sqrt(a2 * a2 + b * b);
      const akRe = Math.sqrt((m + a2) / 2);
      const akIm = Math.sqrt(Math.max(0, (m - a2) / 2));
      const bRe = akRe / mu;
      const bIm = akIm / mu;
      const d = layer.thicknessM!;
      let tRe: number;
      let tIm: number;
      const x = akRe * d;
      if (x >= OPAQUE_LAYER) {
        tRe = 1;
        tIm = 0;
      } else if (m * d * d < THIN_LAYER * THIN_LAYER) {
        // tanh z = z − z³/3 + 2z⁵/15 − 17z⁷/315 + 62z⁹/2835, by Horner in z²
        const zRe = x;
        const zIm = akIm * d;
        const z2Re = zRe * zRe - zIm * zIm;
        const z2Im = 2 * zRe * zIm;
        let pRe = 62 / 2835;
        let pIm = 0;
        for (const c of TANH_SERIES) {
          const r = pRe * z2Re - pIm * z2Im + c;
          pIm = pRe * z2Im + pIm * z2Re;
          pRe = r;
        }
        tRe = pRe * zRe - pIm * zIm;
        tIm = pRe * zIm + pIm * zRe;
      } else {
        // tanh(x + jy) through e^{−2z}, safe for thick layers
        const e = Math.exp(-2 * x);
        const y2 = 2 * akIm * d;
        const eRe = e * Math.cos(y2);
        const eIm = -e * Math.sin(y2);
        const nRe = 1 - eRe;
        const nIm = -eIm;
        const dRe = 1 + eRe;
        const dIm = eIm;
        const dd = dRe * dRe + dIm * dIm;
        tRe = (nRe * dRe + nIm * dIm) / dd;
        tIm = (nIm * dRe - nRe * dIm) / dd;
      }
      // num = β(Y + βt), den = β + Yt
      const sRe = yRe + (bRe * tRe - bIm * tIm);
      const sIm = yIm + (bRe * tIm + bIm * tRe);
      const numRe = bRe * sRe - bIm * sIm;
      const numIm = bRe * sIm + bIm * sRe;
      const denRe = bRe + (yRe * tRe - yIm * tIm);
      const denIm = bIm + (yRe * tIm + yIm * tRe);
      const dd = denRe * denRe + denIm * denIm;
      yRe = (numRe * denRe + numIm * denIm) / dd;
      yIm = (numIm * denRe - numRe * denIm) / dd;
    }
    // R = (α − Y)/(α + Y)
    const nRe = alpha - yRe;
    const nIm = -yIm;
    const dRe = alpha + yRe;
    const dIm = yIm;
    const dd = dRe * dRe + dIm * dIm;
    const w = weights[i]!;
    sumRe += (w * (nRe * dRe + nIm * dIm)) / dd;
    sumIm += (w * (nIm * dRe - nRe * dIm)) / dd;
  }
  return [sumRe, sumIm];
}

/** The series coefficients of tanh after the z⁹ one, highest first, for Horner's scheme in z². */
const TANH_SERIES = [-17 / 315, 2 / 15, -1 / 3, 1];

export interface ImpedancePoint {
  frequencyHz: number;
  /** Coil in air. */
  inductanceInAirH: number;
  reactanceInAirOhm: number;
  /** Change of impedance caused by the conductor, Ω. */
  deltaResistanceOhm: number;
  deltaReactanceOhm: number;
  /** Over the conductor: L = (X0 + ΔX)/ω and R = ΔR (the winding's own resistance excluded). */
  inductanceOverConductorH: number;
  resistanceOverConductorOhm: number;
  /** ΔR/X0 and (X0 + ΔX)/X0, the normalised impedance plane. */
  normalizedResistance: number;
  normalizedReactance: number;
}

/**
 * Impedance of the coil over the layered conductor at one frequency (Dodd & Deeds 1968). The
 * kernel carries coil and lift-off; build it once for a sweep.
 */
export function impedanceAt(
  kernel: DoddDeedsKernel,
  layers: ConductorLayer[],
  frequencyHz: number,
  inductanceInAirH = coilInAirInductance(kernel),
): ImpedancePoint {
  const omega = 2 * Math.PI * frequencyHz;
  const [iRe, iIm] = reflectionIntegral(kernel, layers, omega);
  // ΔZ = jω·scale·(iRe + j·iIm) = ω·scale·(−iIm + j·iRe)
  const deltaR = -omega * kernel.scale * iIm;
  const deltaX = omega * kernel.scale * iRe;
  const x0 = omega * inductanceInAirH;
  // The ratios with ω cancelled: at a frequency so low that ωL0 underflows they stay finite.
  const deltaL = kernel.scale * iRe;
  return {
    frequencyHz,
    inductanceInAirH,
    reactanceInAirOhm: x0,
    deltaResistanceOhm: deltaR,
    deltaReactanceOhm: deltaX,
    inductanceOverConductorH: inductanceInAirH + deltaL,
    resistanceOverConductorOhm: deltaR,
    normalizedResistance: (-kernel.scale * iIm) / inductanceInAirH,
    normalizedReactance: 1 + deltaL / inductanceInAirH,
  };
}

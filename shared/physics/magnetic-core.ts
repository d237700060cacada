/**
 * A linear magnetic core coaxial with the drive coil, by the magnetostatic moment method
 * (volume-integral method with the magnetization as unknown): Chadebec, Coulomb & Janet, "A review
 * of magnetostatic moment method", IEEE Trans. Magn. 42(4), 515–520 (2006).
 *
 * Axisymmetric form, as built here:
 * - The core is cut into ring cells (r0…r1 × z0…z1), each of uniform magnetization (Mr, Mz).
 * - A uniformly magnetized cell has no volume current (∇×M = 0), only the surface currents
 *   K = M × n on its four faces, all azimuthal: +Mz on the outer cylinder, −Mz on the inner one,
 *   −Mr on the top disc, +Mr on the bottom disc. Their field is that of coaxial current loops
 *   (Br, Bz of a loop by the complete elliptic integrals) integrated along each face by
 *   Gauss–Legendre quadrature, refined until the face is far from the field point.
 * - Collocation at the cell centres: M = χ·H with χ = µr − 1, H the field of the sources plus that
 *   of every cell (H = B/µ0 − M inside the cell's own volume). With H as unknown the system is
 *   (D − χ·D·G)·H = w, D the cell volumes and w = ∫cell H_source dV (the source field averaged
 *   over each cell); it is factored once by LU with partial pivoting.
 * - The flux the magnetized core sends through a coaxial ring a is, by reciprocity, ∫ M·B_a dV:
 *   with M uniform in each cell that is µ0·Σ M_i·w_a,i exactly, so the extra mutual inductance
 *   between circuits a and b is µ0·χ·w_aᵀ·(D − χDG)⁻¹·w_b. The exact operator D·G is symmetric
 *   (the mutual energy of two magnetized cells); collocation leaves it so only to the
 *   discretization error, and the inductances are symmetrized, ΔM_ab = ΔM_ba, as the circuit's
 *   energy balance requires. The system is not symmetrized instead: near µr ≈ 1e5 its symmetric
 *   part turns indefinite for slender cores and the answers jump, while the collocation system
 *   itself stays well conditioned (docs/cored-coil.md).
 *
 * Assumptions (said again where the launch reports its figures): the core is linear and isotropic
 * below saturation, carries no eddy current (laminated steel or ferrite), and has no hysteresis.
 * SI throughout: lengths in m, H in A/m per ampere of source current.
 */
import { MU0 } from './constants';
import { gaussLegendre } from './gauss-legendre';

/** A coaxial magnetic core in the bore of the drive coil, its face flush with the coil's. */
export interface CoreSpec {
  /** Radius of the core, m: at most the winding's inner radius. */
  radiusM: number;
  /** Length from the coil face backward, m; it may reach beyond the winding. */
  lengthM: number;
  /** Relative permeability µr below saturation (≥ 1). */
  relativePermeability: number;
  /** Flux density at which the core saturates, T: above it the linear model overstates the core. */
  saturationFluxDensityT: number;
}

/** One ring cell of a core: r from `innerRadiusM` to `outerRadiusM`, z from `bottomM` to `topM`. */
export interface CoreCell {
  innerRadiusM: number;
  outerRadiusM: number;
  bottomM: number;
  topM: number;
}

/** A coaxial current ring (a filament of the coil or the blank): radius, plane and turns. */
export interface CoreRing {
  radiusM: number;
  zM: number;
  turns: number;
}

/** How finely a cylindrical core is cut: cells across the radius and along the length. */
export interface CoreMesh {
  radial: number;
  axial: number;
}

/** Cells of a core when the caller gives none: the launch's default (see docs/cored-coil.md). */
export const DEFAULT_CORE_MESH: CoreMesh = { radial: 6, axial: 24 };

// ---------------------------------------------------------------- elliptic integrals and loops

/** K(m) and E(m) of the last {@link ellipticKE} call (reused: the inner loops must not allocate). */
const ke = { k: 0, e: 0 };

/**
 * Complete elliptic integrals K(m) and E(m), m = k², together by the arithmetic–geometric mean
 * (DLMF 19.8.1 for K, 19.8.6 for E): a0 = 1, b0 = √(1 − m), c0² = m;
 * K = π/(2·AGM), E = K·(1 − Σ 2^(n−1)·c_n²). Three times faster here than two separate calls to
 * @stdlib's ellipk and ellipe, and within 4e-15 of them for 0 ≤ m < 1.
 * @example ellipticKE(0.5); ke // { k: 1.8540746773013719, e: 1.3506438810476755 }
 */
function ellipticKE(m: number): void {
  let a = 1;
  let b = Math.sqrt(1 - m);
  let sum = m / 2;
  let power = 0.5;
  for (let n = 0; n < 12 && Math.abs(a - b) > 1e-15 * a; n++) {
    const c = (a - b) / 2;
    const mean = (a + b) / 2;
    b = Math.sqrt(a * b);
    a = mean;
    power *= 2;
    sum += power * c * c;
  }
  ke.k = Math.PI / (2 * a);
  ke.e = ke.k * (1 - sum);
}

/** The field of the last {@link loopH} or sheet evaluation, A/m (reused, for the same reason). */
const field = { r: 0, z: 0 };

/**
 * Magnetic field H of a circular loop carrying 1 A, radius a, in the plane z = 0, at (ρ, z), A/m
 * (Smythe, Static and Dynamic Electricity, 3rd ed., §7.10; in the form of Simpson, Lane, Immer &
 * Youngquist, NASA/TM-2013-217919): with α² = (a − ρ)² + z², β² = (a + ρ)² + z², m = 1 − α²/β²,
 *   Hz = [(a² − ρ² − z²)·E(m) + α²·K(m)] / (2π·α²·β),
 *   Hρ = z·[(a² + ρ² + z²)·E(m) − α²·K(m)] / (2π·α²·β·ρ).
 * Near the axis and for a loop small against its distance the brackets cancel to a part in
 * 1/m: there the first terms of the series (on-axis field, and the dipole) take over, each exact
 * to a part in 1e-8 where it is used. Writes `field`.
 * @example loopH(1, 0, 0); field // { r: 0, z: 0.5 }: 1/(2a) at the centre
 */
function loopH(a: number, rho: number, z: number): void {
  const d2 = a * a + z * z;
  if (rho < 1e-4 * Math.sqrt(d2)) {
    const d = Math.sqrt(d2);
    field.z = (a * a) / (2 * d2 * d);
    field.r = (3 * a * a * z * rho) / (4 * d2 * d2 * d);
    return;
  }
  const r2 = rho * rho + z * z;
  if (a < 1e-4 * Math.sqrt(r2)) {
    // A point dipole of moment πa²·1 A along z.
    const r = Math.sqrt(r2);
    const r5 = r2 * r2 * r;
    field.z = (a * a * (2 * z * z - rho * rho)) / (4 * r5);
    field.r = (3 * a * a * z * rho) / (4 * r5);
    return;
  }
  const alpha2 = (a - rho) ** 2 + z * z;
  const beta2 = (a + rho) ** 2 + z * z;
  const beta = Math.sqrt(beta2);
  ellipticKE(1 - alpha2 / beta2);
  const scale = 1 / (2 * Math.PI * alpha2 * beta);
  field.z = scale * ((a * a - r2) * ke.e + alpha2 * ke.k);
  field.r = ((scale * z) / rho) * ((a * a + r2) * ke.e - alpha2 * ke.k);
}

/**
 * Magnetic field of a coaxial circular loop carrying 1 A, A/m, as [Hρ, Hz] at the point (ρ, z)
 * relative to the loop's centre ({@link loopH}). µ0 times it is B in T per ampere.
 * @example loopField(1, 0, 1) // [0, 0.17677669529663687]: a²/(2(a² + z²)^{3/2})
 */
export function loopField(radiusM: number, rhoM: number, zM: number): [number, number] {
  loopH(radiusM, rhoM, zM);
  return [field.r, field.z];
}

// ---------------------------------------------------------------- current sheets

/** Accumulator of the sheet integrals. */
const sheet = { r: 0, z: 0 };

/** Highest Gauss–Legendre order used on a panel: a panel that needs more is halved. */
const MAX_PANEL_ORDER = 10;

/**
 * Bernstein-ellipse parameter of a field point relative to a panel: the singular point at
 * w = u + iv in the panel's coordinate scaled to [−1, 1]; ρ = |w + √(w² − 1)|, the larger root.
 * Gauss–Legendre of order n on the panel errs by about ρ^(−2n) (Trefethen, Approximation Theory
 * and Approximation Practice, ch. 19).
 */
function bernsteinRho(u: number, v: number): number {
  // √(w² − 1) for w = u + iv, principal branch.
  const re = u * u - v * v - 1;
  const im = 2 * u * v;
  // Math.hypot is several times slower than the square root in V8, and this runs per panel.
  const mod = Math.sqrt(re * re + im * im);
  let sr = Math.sqrt((mod + re) / 2);
  let si = Math.sqrt(Math.max(0, (mod - re) / 2));
  if (im < 0) si = -si;
  let rho = Math.sqrt((u + sr) ** 2 + (v + si) ** 2);
  if (rho < 1) {
    sr = -sr;
    si = -si;
    rho = Math.sqrt((u + sr) ** 2 + (v + si) ** 2);
  }
  return rho;
}

/**
 * Adds to `sheet` the field at (ρ, z) of a current sheet along the straight panel from (r0, z0) to
 * (r1, z1) in the r–z half-plane: a continuum of coaxial loops carrying `density` A per metre of
 * panel. Adaptive Gauss–Legendre: the order is chosen from the Bernstein parameter for a relative
 * error near 1e-8, and a panel too close to the point for order 10 is halved.
 */
function addPanelField(
  r0: number,
  z0: number,
  r1: number,
  z1: number,
  density: number,
  rho: number,
  z: number,
  depth: number,
): void {
  const half = Math.sqrt((r1 - r0) ** 2 + (z1 - z0) ** 2) / 2;
  if (half === 0 || density === 0) return;
  const tr = (r1 - r0) / (2 * half);
  const tz = (z1 - z0) / (2 * half);
  const dr = rho - (r0 + r1) / 2;
  const dz = z - (z0 + z1) / 2;
  const u = (dr * tr + dz * tz) / half;
  const v = Math.abs(dr * tz - dz * tr) / half;
  const order = Math.ceil(9.2 / Math.log(bernsteinRho(u, v)));
  if (order > MAX_PANEL_ORDER && depth < 40) {
    const rm = (r0 + r1) / 2;
    const zm = (z0 + z1) / 2;
    addPanelField(r0, z0, rm, zm, density, rho, z, depth + 1);
    addPanelField(rm, zm, r1, z1, density, rho, z, depth + 1);
    return;
  }
  const { nodes, weights } = gaussLegendre(Math.max(2, Math.min(order, MAX_PANEL_ORDER)));
  for (let q = 0; q < nodes.length; q++) {
    const t = nodes[q]!;
    const ring = (r0 + r1) / 2 + t * half * tr;
    const plane = (z0 + z1) / 2 + t * half * tz;
    loopH(ring, rho, z - plane);
    const w = weights[q]! * half * density;
    sheet.r += w * field.r;
    sheet.z += w * field.z;
  }
}

// ---------------------------------------------------------------- cells

/** Volume of a ring cell, m³: π(r1² − r0²)(z1 − z0). */
export function cellVolume(cell: CoreCell): number {
  return Math.PI * (cell.outerRadiusM ** 2 - cell.innerRadiusM ** 2) * (cell.topM - cell.bottomM);
}

const cellCentreR = (c: CoreCell) => (c.innerRadiusM + c.outerRadiusM) / 2;
const cellCentreZ = (c: CoreCell) => (c.bottomM + c.topM) / 2;

/**
 * A solid cylindrical core of radius `radiusM` from z = 0 (its face) down to z = −`lengthM`, cut
 * into `radial` equal rings and `axial` slices ({@link axialPlanes}): slices as thin as a ring is
 * wide at both faces, where the coil's field, the blank's image and the far end's pole change
 * fastest, growing toward the middle of a long core.
 * @example cylinderCoreCells(4.5e-3, 20e-3, { radial: 6, axial: 24 }).length // 144
 */
export function cylinderCoreCells(
  radiusM: number,
  lengthM: number,
  mesh: CoreMesh = DEFAULT_CORE_MESH,
): CoreCell[] {
  const planes = axialPlanes(lengthM, mesh.axial, radiusM / mesh.radial);
  const cells: CoreCell[] = [];
  for (let j = 0; j < mesh.axial; j++) {
    for (let i = 0; i < mesh.radial; i++) {
      cells.push({
        innerRadiusM: (i * radiusM) / mesh.radial,
        outerRadiusM: ((i + 1) * radiusM) / mesh.radial,
        bottomM: planes[j + 1]!,
        topM: planes[j]!,
      });
    }
  }
  return cells;
}

/**
 * Planes z_0 = 0 > z_1 > … > z_n = −length: slices `faceSliceM` thick at both faces, growing
 * geometrically (ratio at most 1.25) toward the middle, so that a long core is not cut finer than
 * its field needs; uniform when slices of `faceSliceM` would already fill the length, and
 * stretched evenly when ratio 1.25 cannot.
 */
function axialPlanes(lengthM: number, count: number, faceSliceM: number): number[] {
  // Sizes symmetric about the middle: h_j = h0·q^min(j, n−1−j).
  const sizes = (q: number) =>
    Array.from({ length: count }, (_, j) => faceSliceM * q ** Math.min(j, count - 1 - j));
  const total = (q: number) => sizes(q).reduce((s, h) => s + h, 0);
  let grown: number[];
  if (total(1) >= lengthM) {
    grown = Array.from({ length: count }, () => lengthM / count);
  } else {
    let low = 1;
    let high = 1.25;
    if (total(high) < lengthM) {
      grown = sizes(high);
    } else {
      for (let k = 0; k < 60; k++) {
        const mid = (low + high) / 2;
        if (total(mid) < lengthM) low = mid;
        else high = mid;
      }
      grown = sizes((low + high) / 2);
    }
  }
  const scale = lengthM / grown.reduce((s, h) => s + h, 0);
  const planes = [0];
  for (const h of grown) planes.push(planes.at(-1)! - h * scale);
  planes[count] = -lengthM;
  return planes;
}

// ---------------------------------------------------------------- the factored core

/** A core cut into cells, its moment-method system factored once. */
export interface FactoredCore {
  cells: CoreCell[];
  relativePermeability: number;
  /** χ = µr − 1. */
  susceptibility: number;
  /** Unknowns: (Hr, Hz) per cell. */
  size: number;
  /** LU factors of D − χ·D·G (row-major, size²; L unit lower, U upper) and the row pivots. */
  lu: Float64Array;
  pivots: Int32Array;
}

/** A face of one or more cells: a straight panel in the r–z half-plane, from (r0, z0) to (r1, z1). */
interface Panel {
  r0: number;
  z0: number;
  r1: number;
  z1: number;
}

/**
 * The cells' faces, each once (a face between two cells carries both cells' surface currents),
 * and per cell the indices of its outer, inner, top and bottom faces (−1: a cell on the axis has
 * no inner face). Sharing them halves the quadrature.
 */
function cellFaces(cells: CoreCell[]): { panels: Panel[]; faces: Int32Array } {
  const panels: Panel[] = [];
  const index = new Map<string, number>();
  const face = (r0: number, z0: number, r1: number, z1: number) => {
    const key = `${r0} ${z0} ${r1} ${z1}`;
    let k = index.get(key);
    if (k === undefined) {
      k = panels.push({ r0, z0, r1, z1 }) - 1;
      index.set(key, k);
    }
    return k;
  };
  const faces = new Int32Array(4 * cells.length);
  cells.forEach((c, j) => {
    faces[4 * j] = face(c.outerRadiusM, c.bottomM, c.outerRadiusM, c.topM);
    faces[4 * j + 1] =
      c.innerRadiusM > 0 ? face(c.innerRadiusM, c.bottomM, c.innerRadiusM, c.topM) : -1;
    faces[4 * j + 2] = face(c.innerRadiusM, c.topM, c.outerRadiusM, c.topM);
    faces[4 * j + 3] = face(c.innerRadiusM, c.bottomM, c.outerRadiusM, c.bottomM);
  });
  return { panels, faces };
}

/**
 * Interaction matrix of the cells, volume-weighted: entry (2i + p, 2j + q) is V_i times the
 * component p of H at the centre of cell i due to cell j magnetized with unit component q
 * (collocation). A cell magnetized (mr, mz) carries K = M × n on its faces: +mz on the outer,
 * −mz on the inner, −mr on the top, +mr on the bottom; H is their B/µ0, less M inside the cell
 * itself.
 */
function weightedInteraction(cells: CoreCell[]): Float64Array {
  const n = cells.length;
  const size = 2 * n;
  const { panels, faces } = cellFaces(cells);
  const pr = new Float64Array(panels.length);
  const pz = new Float64Array(panels.length);
  const dg = new Float64Array(size * size);
  for (let i = 0; i < n; i++) {
    const rho = cellCentreR(cells[i]!);
    const z = cellCentreZ(cells[i]!);
    const v = cellVolume(cells[i]!);
    panels.forEach((p, k) => {
      sheet.r = 0;
      sheet.z = 0;
      addPanelField(p.r0, p.z0, p.r1, p.z1, 1, rho, z, 0);
      pr[k] = sheet.r;
      pz[k] = sheet.z;
    });
    const rowR = 2 * i * size;
    const rowZ = rowR + size;
    for (let j = 0; j < n; j++) {
      const outer = faces[4 * j]!;
      const inner = faces[4 * j + 1]!;
      const top = faces[4 * j + 2]!;
      const bottom = faces[4 * j + 3]!;
      const self = i === j ? 1 : 0;
      // Unit mr: the bottom face's sheet less the top's.
      dg[rowR + 2 * j] = v * (pr[bottom]! - pr[top]! - self);
      dg[rowZ + 2 * j] = v * (pz[bottom]! - pz[top]!);
      // Unit mz: the outer face's sheet less the inner's.
      dg[rowR + 2 * j + 1] = v * (pr[outer]! - (inner >= 0 ? pr[inner]! : 0));
      dg[rowZ + 2 * j + 1] = v * (pz[outer]! - (inner >= 0 ? pz[inner]! : 0) - self);
    }
  }
  return dg;
}

/**
 * LU factorization with partial pivoting, P·A = L·U, of a square matrix (row-major, n×n), in
 * place: L (unit lower, below the diagonal) and U share the array. Returns the row swaps, or
 * null for a singular matrix (Golub & Van Loan, Matrix Computations, 4th ed., Alg. 3.4.1).
 */
export function luFactor(a: Float64Array, n: number): Int32Array | null {
  const pivots = new Int32Array(n);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r * n + c]!) > Math.abs(a[p * n + c]!)) p = r;
    pivots[c] = p;
    if (a[p * n + c] === 0) return null;
    if (p !== c) {
      for (let j = 0; j < n; j++) {
        const t = a[c * n + j]!;
        a[c * n + j] = a[p * n + j]!;
        a[p * n + j] = t;
      }
    }
    const d = a[c * n + c]!;
    for (let r = c + 1; r < n; r++) {
      const f = (a[r * n + c] = a[r * n + c]! / d);
      if (f === 0) continue;
      const rowR = r * n;
      const rowC = c * n;
      for (let j = c + 1; j < n; j++) a[rowR + j] = a[rowR + j]! - f * a[rowC + j]!;
    }
  }
  return pivots;
}

/**
 * Solves A·X = B in place with the factors of {@link luFactor}, for `count` right-hand sides at
 * once (B row-major, n × count): each row of the factors is read once for all of them, which is
 * what keeps the launch's tables cheap (the factors do not fit in cache).
 */
export function luSolve(
  lu: Float64Array,
  pivots: Int32Array,
  n: number,
  b: Float64Array,
  count = 1,
): void {
  for (let i = 0; i < n; i++) {
    const p = pivots[i]!;
    if (p === i) continue;
    for (let c = 0; c < count; c++) {
      const t = b[i * count + c]!;
      b[i * count + c] = b[p * count + c]!;
      b[p * count + c] = t;
    }
  }
  for (let i = 0; i < n; i++) {
    const row = i * n;
    const bi = i * count;
    for (let k = 0; k < i; k++) {
      const f = lu[row + k]!;
      if (f === 0) continue;
      const bk = k * count;
      for (let c = 0; c < count; c++) b[bi + c] = b[bi + c]! - f * b[bk + c]!;
    }
  }
  // Back substitution column by column of U (row by row of the array read in order).
  for (let i = n - 1; i >= 0; i--) {
    const row = i * n;
    const bi = i * count;
    const d = lu[row + i]!;
    for (let c = 0; c < count; c++) b[bi + c] = b[bi + c]! / d;
    for (let k = 0; k < i; k++) {
      const f = lu[k * n + i]!;
      if (f === 0) continue;
      const bk = k * count;
      for (let c = 0; c < count; c++) b[bk + c] = b[bk + c]! - f * b[bi + c]!;
    }
  }
}

/**
 * Builds and factors the moment-method system of a core of relative permeability µr cut into
 * `cells`: (D − χ·D·G)·H = w, χ = µr − 1 (see the file's head). Throws a RangeError for µr < 1,
 * no cells, or a singular system.
 * @example factorCore(cylinderCoreCells(4.5e-3, 20e-3), 1000).size // 288
 */
export function factorCore(cells: CoreCell[], relativePermeability: number): FactoredCore {
  if (!(relativePermeability >= 1) || !Number.isFinite(relativePermeability))
    throw new RangeError('the relative permeability of a core must be a finite number ≥ 1');
  if (!cells.length) throw new RangeError('a core needs at least one cell');
  const chi = relativePermeability - 1;
  const size = 2 * cells.length;
  // The interaction matrix D·G turns into the system D − χ·D·G in place, then into its factors.
  const lu = weightedInteraction(cells);
  for (let r = 0; r < size; r++) {
    const volume = cellVolume(cells[r >> 1]!);
    for (let c = 0; c < size; c++)
      lu[r * size + c] = (r === c ? volume : 0) - chi * lu[r * size + c]!;
  }
  const pivots = luFactor(lu, size);
  if (!pivots) throw new RangeError('the core’s moment-method system is singular');
  return { cells, relativePermeability, susceptibility: chi, size, lu, pivots };
}

// ---------------------------------------------------------------- sources

/**
 * Gauss–Legendre order per direction for averaging a ring's field over a cell, from the ring's
 * distance to the cell over the cell's larger side; 0 means: split the cell first.
 */
function averagingOrder(distance: number, sizeM: number): number {
  const ratio = distance / sizeM;
  if (ratio > 8) return 2;
  if (ratio > 4) return 3;
  if (ratio > 2) return 4;
  if (ratio > 1) return 6;
  return 0;
}

/** Adds ∫ H dV of a 1 A ring over the rectangle (ri…ro × zb…zt) of a ring cell to acc[0..1]. */
function addCellIntegral(
  ring: CoreRing,
  ri: number,
  ro: number,
  zb: number,
  zt: number,
  acc: Float64Array,
  offset: number,
  depth: number,
): void {
  const dr = Math.max(0, ri - ring.radiusM, ring.radiusM - ro);
  const dz = Math.max(0, zb - ring.zM, ring.zM - zt);
  const order = averagingOrder(Math.sqrt(dr * dr + dz * dz), Math.max(ro - ri, zt - zb));
  if (order === 0 && depth < 8) {
    const rm = (ri + ro) / 2;
    const zm = (zb + zt) / 2;
    addCellIntegral(ring, ri, rm, zb, zm, acc, offset, depth + 1);
    addCellIntegral(ring, rm, ro, zb, zm, acc, offset, depth + 1);
    addCellIntegral(ring, ri, rm, zm, zt, acc, offset, depth + 1);
    addCellIntegral(ring, rm, ro, zm, zt, acc, offset, depth + 1);
    return;
  }
  const { nodes, weights } = gaussLegendre(order || 8);
  const hr = (ro - ri) / 2;
  const hz = (zt - zb) / 2;
  for (let p = 0; p < nodes.length; p++) {
    const r = (ri + ro) / 2 + nodes[p]! * hr;
    const wr = weights[p]! * hr * 2 * Math.PI * r;
    for (let q = 0; q < nodes.length; q++) {
      const z = (zb + zt) / 2 + nodes[q]! * hz;
      loopH(ring.radiusM, r, z - ring.zM);
      const w = wr * weights[q]! * hz * ring.turns;
      acc[offset] = acc[offset]! + w * field.r;
      acc[offset + 1] = acc[offset + 1]! + w * field.z;
    }
  }
}

/**
 * The source vector of a circuit of coaxial rings in series (1 A through each, times its turns):
 * w = ∫cell H dV per cell, (r, z) interleaved, A·m² per ampere. It is both the field that drives the
 * core and, by reciprocity, the functional that gives the flux the magnetized core sends through
 * the circuit (µ0·Σ M_i·w_i, exact for cells of uniform M).
 */
export function sourceMoments(cells: CoreCell[], rings: CoreRing[]): Float64Array {
  const w = new Float64Array(2 * cells.length);
  for (let i = 0; i < cells.length; i++) {
    const c = cells[i]!;
    for (const ring of rings)
      addCellIntegral(ring, c.innerRadiusM, c.outerRadiusM, c.bottomM, c.topM, w, 2 * i, 0);
  }
  return w;
}

/** The source vector of a uniform axial field `h0` A/m over the cells (tests, demagnetizing factors). */
export function uniformFieldMoments(cells: CoreCell[], h0: number): Float64Array {
  const w = new Float64Array(2 * cells.length);
  cells.forEach((c, i) => (w[2 * i + 1] = cellVolume(c) * h0));
  return w;
}

/**
 * The field H in each cell (collocated at its centre), (r, z) interleaved, A/m, for a source
 * vector w: H = K⁻¹w with K = D − χ·D·G. The magnetization is χ·H and the flux density µ0·µr·H.
 */
export function coreField(core: FactoredCore, w: Float64Array): Float64Array {
  const h = Float64Array.from(w);
  luSolve(core.lu, core.pivots, core.size, h);
  return h;
}

/**
 * The flux through a circuit with source vector `wa` from the core as magnetized by a circuit
 * with source vector `wb` carrying 1 A, Wb: µ0·χ·w_aᵀ·K⁻¹·w_b, K = D − χDG. Reciprocity makes it
 * equal to the flux through b from a; the collocation system keeps that to its discretization
 * error, which is what {@link coreMutualInductance} averages away.
 */
export function coreFluxLinkage(core: FactoredCore, wa: Float64Array, wb: Float64Array): number {
  return MU0 * core.susceptibility * dot(wa, coreField(core, wb));
}

/**
 * The extra mutual inductance that the core adds between two circuits of coaxial rings, H: the
 * flux through circuit a from the core as magnetized by 1 A in circuit b, averaged with the
 * reverse ({@link coreFluxLinkage}), so that ΔM_ab = ΔM_ba exactly. With a = b (the default), the
 * circuit's extra self-inductance.
 * @example coreMutualInductance(factorCore(cylinderCoreCells(4.5e-3, 20e-3), 1000), coilFilaments(coil, 4, 4)) // 1.52e-4 H for Pulse Bench's default coil (radii 5 and 9.5 mm, 4 mm long, 100 turns)
 */
export function coreMutualInductance(core: FactoredCore, a: CoreRing[], b: CoreRing[] = a): number {
  const wa = sourceMoments(core.cells, a);
  if (a === b) return coreFluxLinkage(core, wa, wa);
  const wb = sourceMoments(core.cells, b);
  return (coreFluxLinkage(core, wa, wb) + coreFluxLinkage(core, wb, wa)) / 2;
}

/**
 * The largest mean flux density over a cross-section of the core, T: for each slice of cells,
 * |Σ µ0·µr·Hz·A| / Σ A, A the cells' areas in the section (B = µ0·µr·H inside a linear core).
 * The flux a section carries over its area is what saturates a core as a whole; cell by cell the
 * field runs higher at the edge next to the winding, and grows there as the cells get finer (a
 * corner of a permeable body), so a single cell's value would be the mesh's, not the core's.
 */
export function peakFluxDensity(core: FactoredCore, h: Float64Array): number {
  const hz = new Float64Array(core.cells.length);
  for (let i = 0; i < hz.length; i++) hz[i] = h[2 * i + 1]!;
  return MU0 * core.relativePermeability * largestSectionMean(coreSections(core.cells), hz);
}

/** The cells grouped by slice (same bottom and top), with each cell's share of the slice's area. */
function coreSections(cells: CoreCell[]): Array<{ cells: number[]; weights: number[] }> {
  const bySlice = new Map<string, { cells: number[]; weights: number[] }>();
  cells.forEach((c, i) => {
    const key = `${c.bottomM} ${c.topM}`;
    const section = bySlice.get(key) ?? { cells: [], weights: [] };
    section.cells.push(i);
    section.weights.push(Math.PI * (c.outerRadiusM ** 2 - c.innerRadiusM ** 2));
    bySlice.set(key, section);
  });
  return [...bySlice.values()].map(({ cells: members, weights }) => {
    const area = weights.reduce((a, b) => a + b, 0);
    return { cells: members, weights: weights.map((w) => w / area) };
  });
}

/** Largest |area-weighted mean of Hz| over the sections, A/m. */
function largestSectionMean(
  sections: Array<{ cells: number[]; weights: number[] }>,
  hz: Float64Array,
): number {
  let peak = 0;
  for (const { cells, weights } of sections) {
    let mean = 0;
    for (let k = 0; k < cells.length; k++) mean += weights[k]! * hz[cells[k]!]!;
    peak = Math.max(peak, Math.abs(mean));
  }
  return peak;
}

/** Volume-averaged magnetization of the core for a cell field H, as [Mr, Mz], A/m. */
export function meanMagnetization(core: FactoredCore, h: Float64Array): [number, number] {
  let volume = 0;
  let mr = 0;
  let mz = 0;
  core.cells.forEach((c, i) => {
    const v = cellVolume(c);
    volume += v;
    mr += v * h[2 * i]!;
    mz += v * h[2 * i + 1]!;
  });
  return [(core.susceptibility * mr) / volume, (core.susceptibility * mz) / volume];
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i]! * b[i]!;
  return s;
}

// ---------------------------------------------------------------- the launch's tables

/**
 * What the launch needs from the core, for a fixed circuit (the coil) and rings that move together
 * along the axis by s ≥ 0 (the blank's filaments), all as extra inductances over the air-core ones:
 * - `fixedH`: the coil's extra self-inductance ΔL1, H;
 * - `at(s, …)`: the extra coil–ring mutuals Δm_k(s) and ring–ring matrix ΔLb_kj(s) with their
 *   derivatives in s, H and H/m; tabulated once on a grid and interpolated by cubic Hermite pieces,
 *   so that the derivative is the exact derivative of the interpolant (the circuit's energy ledger
 *   balances against the same L(s) the force comes from);
 * - `peakFluxDensity(s, i1, ib)`: the largest mean flux density over a cross-section of the core
 *   ({@link peakFluxDensity}) for the coil current and ring currents, T (the rings' fields
 *   interpolated linearly between grid points).
 */
export interface CoreCoupling {
  fixedH: number;
  at(s: number, dm: Float64Array, ddm: Float64Array, dlb: Float64Array, ddlb: Float64Array): void;
  peakFluxDensity(s: number, coilCurrentA: number, ringCurrentsA: ArrayLike<number>): number;
}

/** Grid points per e-fold of distance from the core face in the launch's tables. */
const NODES_PER_EFOLD = 6;

/**
 * Tabulates {@link CoreCoupling} for the coil `fixed` and the rings `moving` (at their s = 0
 * positions, above the core face z = 0) for 0 ≤ s ≤ `sMaxM`. The grid is uniform in
 * u = ln(s + z_min), z_min the lowest ring's height above the face, since the image field of a
 * ring changes on the scale of its distance from the face; beyond `sMaxM` the values stay at the
 * last point's (the blank has left the field by then).
 */
export function coreCoupling(
  core: FactoredCore,
  fixed: CoreRing[],
  moving: CoreRing[],
  sMaxM: number,
  nodesPerEfold = NODES_PER_EFOLD,
): CoreCoupling {
  const { size, cells } = core;
  const gain = MU0 * core.susceptibility;
  const nb = moving.length;
  const wc = sourceMoments(cells, fixed);
  const hc = coreField(core, wc);
  const fixedH = gain * dot(wc, hc);

  const zMin = Math.min(...moving.map((r) => r.zM));
  const u0 = Math.log(zMin);
  const span = Math.log(sMaxM + zMin) - u0;
  const points = Math.max(4, Math.ceil(span * nodesPerEfold) + 1);
  const du = span / (points - 1);
  const pairs = (nb * (nb + 1)) / 2;
  const width = nb + pairs;
  // values[p·width + f]: f < nb the coil–ring mutual, then the ring pairs (k ≤ j).
  const values = new Float64Array(points * width);
  // ringFields[(p·size + c)·nb + k]: component c of H in the core for 1 A in ring k at point p.
  const ringFields = new Float64Array(points * size * nb);
  const w = new Float64Array(size * nb);
  for (let p = 0; p < points; p++) {
    const s = Math.exp(u0 + p * du) - zMin;
    // W (size × nb): the rings' source vectors; H = K⁻¹W, all rings at once.
    for (let k = 0; k < nb; k++) {
      const ring = moving[k]!;
      const wk = sourceMoments(cells, [{ ...ring, zM: ring.zM + s }]);
      for (let c = 0; c < size; c++) w[c * nb + k] = wk[c]!;
    }
    const h = ringFields.subarray(p * size * nb, (p + 1) * size * nb);
    h.set(w);
    luSolve(core.lu, core.pivots, size, h, nb);
    // Flux linkages both ways, averaged (coreFluxLinkage): ½·gain·(w_a·h_b + w_b·h_a).
    const row = p * width;
    for (let c = 0; c < size; c++) {
      const base = c * nb;
      for (let k = 0; k < nb; k++)
        values[row + k] =
          values[row + k]! + (gain / 2) * (wc[c]! * h[base + k]! + w[base + k]! * hc[c]!);
      let f = nb;
      for (let k = 0; k < nb; k++) {
        const wk = w[base + k]!;
        const hk = h[base + k]!;
        for (let j = k; j < nb; j++, f++)
          values[row + f] = values[row + f]! + (gain / 2) * (wk * h[base + j]! + w[base + j]! * hk);
      }
    }
  }
  const slopes = hermiteSlopes(values, points, width, du);
  const sections = coreSections(cells);
  const out = new Float64Array(width);
  const outSlope = new Float64Array(width);

  const locate = (s: number) => {
    const u = Math.log(Math.max(s, 0) + zMin);
    const x = Math.min(Math.max((u - u0) / du, 0), points - 1);
    const p = Math.min(Math.floor(x), points - 2);
    return { p, t: x - p, beyond: u - u0 > span, dudS: 1 / (Math.max(s, 0) + zMin) };
  };

  return {
    fixedH,
    at(s, dm, ddm, dlb, ddlb) {
      const { p, t, beyond, dudS } = locate(s);
      // Cubic Hermite basis on [p, p+1] in t, and its t-derivative.
      const t2 = t * t;
      const t3 = t2 * t;
      const h00 = 2 * t3 - 3 * t2 + 1;
      const h10 = t3 - 2 * t2 + t;
      const h01 = -2 * t3 + 3 * t2;
      const h11 = t3 - t2;
      const d00 = (6 * t2 - 6 * t) / du;
      const d10 = (3 * t2 - 4 * t + 1) / du;
      const d01 = (-6 * t2 + 6 * t) / du;
      const d11 = (3 * t2 - 2 * t) / du;
      // Value and s-derivative of field f: c·(v_p, du·v′_p, v_p+1, du·v′_p+1) with the weights below.
      const a = p * width;
      const b = a + width;
      const scale = beyond ? 0 : dudS;
      for (let f = 0; f < width; f++) {
        const va = values[a + f]!;
        const sa = du * slopes[a + f]!;
        const vb = values[b + f]!;
        const sb = du * slopes[b + f]!;
        out[f] = h00 * va + h10 * sa + h01 * vb + h11 * sb;
        outSlope[f] = scale * (d00 * va + d10 * sa + d01 * vb + d11 * sb);
      }
      for (let k = 0; k < nb; k++) {
        dm[k] = out[k]!;
        ddm[k] = outSlope[k]!;
      }
      let f = nb;
      for (let k = 0; k < nb; k++) {
        for (let j = k; j < nb; j++, f++) {
          dlb[k * nb + j] = dlb[j * nb + k] = out[f]!;
          ddlb[k * nb + j] = ddlb[j * nb + k] = outSlope[f]!;
        }
      }
    },
    peakFluxDensity(s, coilCurrentA, ringCurrentsA) {
      const { p, t } = locate(s);
      const lo = p * size * nb;
      const hi = lo + size * nb;
      const hz = new Float64Array(cells.length);
      for (let i = 0; i < cells.length; i++) {
        const z = 2 * i + 1;
        let sum = coilCurrentA * hc[z]!;
        for (let k = 0; k < nb; k++)
          sum +=
            ringCurrentsA[k]! *
            ((1 - t) * ringFields[lo + z * nb + k]! + t * ringFields[hi + z * nb + k]!);
        hz[i] = sum;
      }
      return MU0 * core.relativePermeability * largestSectionMean(sections, hz);
    },
  };
}

/**
 * Slopes df/du at the grid points for cubic Hermite interpolation: central differences inside,
 * second-order one-sided differences at the ends (a C¹ interpolant, third-order accurate).
 */
function hermiteSlopes(
  values: Float64Array,
  points: number,
  width: number,
  du: number,
): Float64Array {
  const slopes = new Float64Array(values.length);
  for (let f = 0; f < width; f++) {
    const v = (p: number) => values[p * width + f]!;
    for (let p = 1; p < points - 1; p++) slopes[p * width + f] = (v(p + 1) - v(p - 1)) / (2 * du);
    slopes[f] = (-3 * v(0) + 4 * v(1) - v(2)) / (2 * du);
    const last = points - 1;
    slopes[last * width + f] = (3 * v(last) - 4 * v(last - 1) + v(last - 2)) / (2 * du);
  }
  return slopes;
}

/**
 * Adaptive Runge–Kutta 5(4) of Dormand & Prince (J. Comput. Appl. Math. 6, 19, 1980), with the
 * usual step-size control (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4). Our own rather
 * than mathjs' solveODE because the launch must stop when the blank has left the field (mathjs
 * integrates to a fixed end time with no event hook), must honour a compute deadline, and runs in
 * the browser where mathjs would add some 180 kB for this one function.
 */
export type Derivative = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface Rk45Options {
  rtol: number;
  /** Absolute tolerance per component. */
  atol: Float64Array;
  firstStep: number;
  maxStep: number;
  maxSteps: number;
  /** Called after every accepted step; return true to stop. */
  onStep: (t: number, y: Float64Array) => boolean;
  /** performance.now() after which the integration throws. */
  deadline?: number;
}

const C = [0, 1 / 5, 3 / 10, 4 / 5, 8 / 9, 1, 1];
const A = [
  [],
  [1 / 5],
  [3 / 40, 9 / 40],
  [44 / 45, -56 / 15, 32 / 9],
  [19372 / 6561, -25360 / 2187, 64448 / 6561, -212 / 729],
  [9017 / 3168, -355 / 33, 46732 / 5247, 49 / 176, -5103 / 18656],
  [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84],
];
// 5th-order weights are A[6]; E = b5 − b4 for the error estimate.
const E = [71 / 57600, 0, -71 / 16695, 71 / 1920, -17253 / 339200, 22 / 525, -1 / 40];

export class StepLimitError extends Error {}

/** Integrates y′ = f(t, y) from t0 until onStep says stop; returns the final time and state. */
export function integrateRk45(
  f: Derivative,
  t0: number,
  y0: Float64Array,
  options: Rk45Options,
): { t: number; y: Float64Array; steps: number } {
  const n = y0.length;
  const k = Array.from({ length: 7 }, () => new Float64Array(n));
  const yStage = new Float64Array(n);
  let y = Float64Array.from(y0);
  let yNew = new Float64Array(n);
  let t = t0;
  let h = options.firstStep;
  f(t, y, k[0]!);
  for (let steps = 0; steps < options.maxSteps; steps++) {
    if (
      options.deadline !== undefined &&
      (steps & 63) === 0 &&
      performance.now() > options.deadline
    ) {
      throw new StepLimitError('deadline');
    }
    for (let s = 1; s < 7; s++) {
      const a = A[s]!;
      for (let i = 0; i < n; i++) {
        let acc = y[i]!;
        for (let j = 0; j < s; j++) acc += h * a[j]! * k[j]![i]!;
        yStage[i] = acc;
      }
      // The last stage's input is the 5th-order solution itself (Dormand–Prince is FSAL).
      if (s === 6) yNew.set(yStage);
      f(t + C[s]! * h, yStage, k[s]!);
    }
    let err = 0;
    for (let i = 0; i < n; i++) {
      let e = 0;
      for (let j = 0; j < 7; j++) e += E[j]! * k[j]![i]!;
      const scale = options.atol[i]! + options.rtol * Math.max(Math.abs(y[i]!), Math.abs(yNew[i]!));
      err = Math.max(err, Math.abs(h * e) / scale);
    }
    if (err <= 1 || h <= 1e-15) {
      t += h;
      [y, yNew] = [yNew, y];
      k[0]!.set(k[6]!); // first same as last
      if (options.onStep(t, y)) return { t, y, steps };
    }
    const factor = err === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * err ** -0.2));
    h = Math.min(options.maxStep, h * factor);
  }
  throw new StepLimitError('step limit');
}

/**
 * The few complex operations the Dodd–Deeds integrand needs, on plain {re, im} pairs. A general
 * library (mathjs' Complex) allocates and dispatches per operation; this is the inner loop of
 * every sweep, so the arithmetic is written out.
 */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });

export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});

export function div(a: Complex, b: Complex): Complex {
  // Smith's algorithm: avoids overflow when |b| is large or small.
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

/** Principal square root (real part ≥ 0). */
export function sqrt(z: Complex): Complex {
  const m = Math.hypot(z.re, z.im);
  if (m === 0) return { re: 0, im: 0 };
  const re = Math.sqrt((m + z.re) / 2);
  const im = Math.sqrt(Math.max(0, (m - z.re) / 2));
  return { re, im: z.im < 0 ? -im : im };
}

/** tanh for Re z ≥ 0, written with e^{-2z} so that thick layers (large Re z) do not overflow. */
export function tanh(z: Complex): Complex {
  const e = Math.exp(-2 * z.re);
  const c = Math.cos(2 * z.im);
  const s = Math.sin(2 * z.im);
  const em = { re: e * c, im: -e * s }; // e^{-2z}
  return div({ re: 1 - em.re, im: -em.im }, { re: 1 + em.re, im: em.im });
}

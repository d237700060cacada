/**
 * Gauss–Legendre nodes and weights on [−1, 1] by Newton iteration on P_n (Golub–Welsch would do
 * as well; this is the classic routine of Numerical Recipes §4.6), cached per order.
 */
const cache = new Map<number, { nodes: Float64Array; weights: Float64Array }>();

export function gaussLegendre(order: number): { nodes: Float64Array; weights: Float64Array } {
  const hit = cache.get(order);
  if (hit) return hit;
  const nodes = new Float64Array(order);
  const weights = new Float64Array(order);
  for (let i = 0; i < Math.ceil(order / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (order + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= order; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (order * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-15) break;
    }
    nodes[i] = -x;
    nodes[order - 1 - i] = x;
    const w = 2 / ((1 - x * x) * dp * dp);
    weights[i] = w;
    weights[order - 1 - i] = w;
  }
  const rule = { nodes, weights };
  cache.set(order, rule);
  return rule;
}

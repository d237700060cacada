import type { CoilGeometry } from '../../shared/physics/coil';
import {
  buildDoddDeedsKernel,
  type DoddDeedsKernel,
  type KernelOptions,
} from '../../shared/physics/dodd-deeds';

const MAX_ENTRIES = 32;
const kernels = new Map<string, DoddDeedsKernel>();

/**
 * Dodd–Deeds kernels by coil and lift-off. A kernel costs as much as a hundred frequency points
 * and sorter tooling asks about the same probe again and again, so the last few are kept. The
 * Sort Planner's coarser kernel (PLAN_KERNEL) is kept under its own key.
 */
export function kernelFor(
  coil: CoilGeometry,
  liftOffM: number,
  options: KernelOptions = {},
): DoddDeedsKernel {
  const key = JSON.stringify([
    options.order ?? null,
    options.refine ?? null,
    coil.innerRadiusM,
    coil.outerRadiusM,
    coil.lengthM,
    coil.turns,
    liftOffM,
  ]);
  let kernel = kernels.get(key);
  if (!kernel) {
    kernel = buildDoddDeedsKernel(coil, liftOffM, options);
    if (kernels.size >= MAX_ENTRIES) kernels.delete(kernels.keys().next().value!);
    kernels.set(key, kernel);
  }
  return kernel;
}

/**
 * The Sort Planner's cost (issue 12): a Monte Carlo plan of 6 products × 40 frequencies × 1,000
 * samples, side by side with the naive cost of the same readings, one full Dodd–Deeds evaluation
 * each (the coil's kernel built at the sample's lift-off, the point, the fit). The naive side is
 * timed on a subset and extrapolated: all of it would take hours. Aim: the plan under ~2 s.
 * Run alone with `npx tsx bench/sort-plan.ts`; `npm run bench` runs it last.
 */
import { pathToFileURL } from 'node:url';
import { createKnex } from '../backend/db/knex';
import { prepareDatabase } from '../backend/db/prepare';
import { createAlloyRepository } from '../backend/db/alloy-repository';
import { createStackRepository } from '../backend/db/stack-repository';
import { CatalogueStore } from '../backend/services/catalogue-store';
import {
  planLimitsFor,
  resolvePlanRequest,
  type SortPlanRequest,
} from '../backend/services/sort-plans';
import {
  fitOnReferenceCurve,
  referenceCurve,
  SIGMA_RANGE,
} from '../shared/physics/apparent-conductivity';
import { buildDoddDeedsKernel, impedanceAt } from '../shared/physics/dodd-deeds';
import { evaluateSortPlan } from '../shared/physics/sort-plan';

const mm = (value: number) => ({ value, unit: 'mm' as const });

/** The five demo coins and a solid zinc strip blank, over 1 kHz–1 MHz. */
const PLAN: SortPlanRequest = {
  products: [
    ...[
      'estmark-1-mark',
      'estmark-2-marks',
      'estmark-5-marks',
      'estmark-10-marks',
      'estmark-20-marks',
    ].map((slug) => ({ name: slug, stack: slug })),
    {
      name: 'zinc strip blank',
      blank: {
        diameter: mm(19),
        layers: [{ material: { alloy: 'zinc-coinage-strip' }, thickness: mm(1.356) }],
      },
    },
  ],
  coil: { innerRadius: mm(1.5), outerRadius: mm(3), length: mm(2), turns: 100 },
  frequencies: { from: { value: 1, unit: 'kHz' }, to: { value: 1, unit: 'MHz' }, points: 40 },
  liftOff: { min: mm(0.4), max: mm(0.6) },
  temperature: { min: { value: 15, unit: '°C' }, max: { value: 35, unit: '°C' } },
  tolerances: { conductivity: 'table', platingThicknessPercent: 10, diameterPercent: 0 },
  method: { kind: 'monteCarlo' as const, samples: 1000, seed: 2026 },
};

/** Readings the naive side actually computes before extrapolating. */
const NAIVE_SUBSET = 60;

export async function benchSortPlan(): Promise<void> {
  const knex = createKnex(':memory:');
  await prepareDatabase(knex, { demo: true, demoAccounts: false });
  const table = await new CatalogueStore(createAlloyRepository(knex)).get();
  const stacks = await createStackRepository(knex).listBuiltIn();
  await knex.destroy();
  const { input } = resolvePlanRequest(PLAN, table, stacks, planLimitsFor('integrator'));

  // Warm the JIT on a small plan first, as a running server would be.
  evaluateSortPlan({ ...input, method: { kind: 'monteCarlo', samples: 20, seed: 1 } });
  const t0 = performance.now();
  const cpu0 = process.cpuUsage();
  const result = evaluateSortPlan(input);
  const planS = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  const planCpuS = (cpu.user + cpu.system) / 1e6;
  const readings = input.products.length * input.frequenciesHz.length * 1000;

  // Naive: for each reading, the standard kernel at that lift-off, the point and the fit.
  const product = input.products[0]!;
  const layers = product.layers.map((l) => ({
    conductivitySPerM: input.materials[l.material]!.conductivity.nominal,
    relativePermeability: input.materials[l.material]!.relativePermeability,
    thicknessM: l.thicknessM,
  }));
  const thickness = layers.reduce((s, l) => s + (l.thicknessM ?? 0), 0);
  const omegas = input.frequenciesHz.map((f) => 2 * Math.PI * f);
  const calibration = buildDoddDeedsKernel(input.coil, 0.5e-3);
  const curve = referenceCurve(
    calibration,
    thickness,
    Math.min(...omegas) * SIGMA_RANGE[0],
    Math.max(...omegas) * SIGMA_RANGE[1],
    impedanceAt(calibration, layers, 1).inductanceInAirH,
  );
  const t1 = performance.now();
  const cpu1 = process.cpuUsage();
  for (let k = 0; k < NAIVE_SUBSET; k++) {
    const f = input.frequenciesHz[k % input.frequenciesHz.length]!;
    const kernel = buildDoddDeedsKernel(input.coil, 0.4e-3 + (0.2e-3 * k) / NAIVE_SUBSET);
    const p = impedanceAt(kernel, layers, f);
    fitOnReferenceCurve(curve, 2 * Math.PI * f, p.normalizedResistance, p.normalizedReactance - 1);
  }
  const perReading = (performance.now() - t1) / 1000 / NAIVE_SUBSET;
  const naiveS = perReading * readings;
  const cpuN = process.cpuUsage(cpu1);
  const naiveCpuS = ((cpuN.user + cpuN.system) / 1e6 / NAIVE_SUBSET) * readings;

  console.log(
    `\nSort Planner, Monte Carlo: ${input.products.length} products × ${input.frequenciesHz.length} frequencies × 1,000 samples = ${readings.toLocaleString('en')} readings, one thread\n`,
  );
  // CPU seconds beside wall-clock ones: on a shared machine the wall clock counts the waiting too.
  console.log(
    'case                                                     wall s      CPU s   per reading µs (wall)',
  );
  const row = (name: string, wall: number, cpuS: number, digits: number) =>
    console.log(
      `${name.padEnd(54)} ${wall.toFixed(digits).padStart(8)} ${cpuS.toFixed(digits).padStart(10)} ${((wall / readings) * 1e6).toFixed(1).padStart(16)}`,
    );
  row('the plan (one kernel per coil, e^(−2αℓ) per sample)', planS, planCpuS, 2);
  row(
    `naive: full Dodd–Deeds per reading (${NAIVE_SUBSET} timed, extrapolated)`,
    naiveS,
    naiveCpuS,
    0,
  );
  console.log(
    `naive / plan: ${(naiveS / planS).toFixed(0)}× wall, ${(naiveCpuS / planCpuS).toFixed(0)}× CPU   (aim: the plan under ~2 s; recommended ${result.recommendedFrequencyHz?.toPrecision(4)} Hz)`,
  );
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await benchSortPlan();

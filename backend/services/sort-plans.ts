import { valueOf } from '../../shared/catalogue/alloy-record';
import type { components } from '../../shared/api/openapi-types';
import { OutsideModelError } from '../../shared/physics/errors';
import type {
  PlanInput,
  PlanMaterial,
  PlanProduct,
  PlanResult,
  PlanWarning,
} from '../../shared/physics/sort-plan';
import {
  baseMetalsFrom,
  estimateAlpha,
  mainElement,
} from '../../shared/match/temperature-estimate';
import type { Caller } from '../auth/roles';
import type { StackRecord } from '../db/stack-repository';
import { ProblemError } from '../http/problem';
import { siFromRequest } from '../http/quantity';
import type { Catalogue } from './catalogue';
import { coilFromRequest, resolveMaterial, sensorLayersFromRequest } from './estimate-inputs';

export type SortPlanRequest = components['schemas']['SortPlanRequest'];
export type SortPlanAnswer = components['schemas']['SortPlanResult'];

/** Plan sizes by caller: visitors and readers run small plans; the production roles larger ones. */
export interface PlanLimits {
  products: number;
  frequencies: number;
  samples: number;
  /** Readings in all: products × frequencies × (samples, or box corners). */
  readings: number;
}

const SMALL: PlanLimits = { products: 6, frequencies: 16, samples: 200, readings: 40_000 };
const LARGE: PlanLimits = { products: 12, frequencies: 64, samples: 5000, readings: 400_000 };

export function planLimitsFor(role: Caller): PlanLimits {
  return role === 'visitor' || role === 'reader' ? SMALL : LARGE;
}

/**
 * Temperatures the linear coefficient is trusted over, K: −50 °C to 150 °C. A sorting line runs
 * near room temperature; over this span the resistivity of copper, zinc and aluminium alloys
 * stays within a few percent of linear (common practice, no source).
 */
export const PLAN_TEMPERATURE_K = { min: 223.15, max: 423.15 };

/** A blank narrower than this many coil outer radii feels its edge (common practice, no source). */
export const EDGE_RADII = 3;

const invalid = (path: string, message: string) =>
  new ProblemError(400, 'Bad request', `${path}: ${message}`, [{ path, message }]);

const tooLarge = (path: string, message: string) =>
  new ProblemError(422, 'Unprocessable content', message, [{ path, message }]);

export function frequenciesOf(frequencies: SortPlanRequest['frequencies']): number[] {
  if (Array.isArray(frequencies))
    return frequencies.map((f, i) => siFromRequest('frequency', f, `/body/frequencies/${i}`));
  const from = siFromRequest('frequency', frequencies.from, '/body/frequencies/from');
  const to = siFromRequest('frequency', frequencies.to, '/body/frequencies/to');
  if (!(to > from)) throw invalid('/body/frequencies/to', 'the sweep must end above its start');
  const n = frequencies.points;
  return Array.from({ length: n }, (_, i) =>
    i === n - 1 ? to : from * Math.exp((i / (n - 1)) * Math.log(to / from)),
  );
}

/**
 * Turns an evaluation request into the engine's input: units to SI, products to layers,
 * every alloy to its range and temperature coefficient at the chosen table. Checks the sizes the
 * caller's role allows. Warnings about inputs (a narrow blank, a missing coefficient) come back
 * beside the input, to be added to the engine's.
 */
export function resolvePlanRequest(
  body: SortPlanRequest,
  table: Catalogue,
  stacks: StackRecord[],
  limits: PlanLimits,
): { input: PlanInput; warnings: PlanWarning[] } {
  const warnings: PlanWarning[] = [];
  if (body.products.length > limits.products)
    throw tooLarge(
      '/body/products',
      `This plan has ${body.products.length} products; your role may evaluate at most ${limits.products} at once.${limits === SMALL ? ' Sign in as an integrator for larger plans.' : ''}`,
    );
  const names = new Set<string>();
  body.products.forEach((p, i) => {
    if (names.has(p.name))
      throw invalid(`/body/products/${i}/name`, `a second product is named '${p.name}'`);
    names.add(p.name);
  });
  const frequenciesHz = frequenciesOf(body.frequencies);
  if (frequenciesHz.length > limits.frequencies)
    throw tooLarge(
      '/body/frequencies',
      `This plan has ${frequenciesHz.length} frequencies; your role may evaluate at most ${limits.frequencies} at once.`,
    );
  if (new Set(frequenciesHz).size !== frequenciesHz.length)
    throw invalid('/body/frequencies', 'a frequency is listed twice');
  const method =
    body.method.kind === 'monteCarlo'
      ? { kind: 'monteCarlo' as const, samples: body.method.samples, seed: body.method.seed }
      : { kind: 'interval' as const };
  if (method.kind === 'monteCarlo' && method.samples > limits.samples)
    throw tooLarge(
      '/body/method/samples',
      `${method.samples} Monte Carlo samples asked; your role may ask for at most ${limits.samples} per product.`,
    );

  const coil = coilFromRequest(body.coil, '/body/coil');
  const liftOffM = {
    min: siFromRequest('length', body.liftOff.min, '/body/liftOff/min'),
    max: siFromRequest('length', body.liftOff.max, '/body/liftOff/max'),
  };
  if (liftOffM.max < liftOffM.min)
    throw invalid('/body/liftOff/max', 'the largest lift-off must not be below the smallest');
  const temperatureK = {
    min: siFromRequest('temperature', body.temperature.min, '/body/temperature/min'),
    max: siFromRequest('temperature', body.temperature.max, '/body/temperature/max'),
  };
  if (temperatureK.max < temperatureK.min)
    throw invalid('/body/temperature/max', 'the highest temperature must not be below the lowest');
  for (const end of ['min', 'max'] as const) {
    const t = temperatureK[end];
    if (t < PLAN_TEMPERATURE_K.min || t > PLAN_TEMPERATURE_K.max)
      throw new OutsideModelError(
        `/body/temperature/${end}`,
        `${Number((t - 273.15).toPrecision(4))} °C is outside −50 °C to 150 °C, where a linear temperature coefficient describes these alloys`,
      );
  }
  const useRange = (body.tolerances?.conductivity ?? 'table') === 'table';
  const platingTolerance = (body.tolerances?.platingThicknessPercent ?? 0) / 100;
  const diameterTolerance = (body.tolerances?.diameterPercent ?? 0) / 100;

  const materials: PlanMaterial[] = [];
  const bySlug = new Map<string, number>();
  const bases = baseMetalsFrom(table.all());
  const noted = new Set<string>();
  const note = (code: PlanWarning['code'], key: string, message: string) => {
    if (noted.has(`${code}:${key}`)) return;
    noted.add(`${code}:${key}`);
    warnings.push({ code, message });
  };

  const alloyMaterial = (slug: string, path: string): number => {
    const known = bySlug.get(slug);
    if (known !== undefined) return known;
    const found = table.find(slug);
    if (!found) throw invalid(path, `no alloy '${slug}' in the table`);
    const c = valueOf(found.record, 'conductivity');
    if (!c) throw invalid(path, `the table has no conductivity for '${slug}'`);
    let min = c.min ?? c.nominal;
    let max = c.max ?? c.nominal;
    if (useRange && (c.min === null || c.max === null))
      note(
        'no-conductivity-range',
        slug,
        `${found.record.name} has no conductivity range in the table: taken at its nominal value.`,
      );
    if (!useRange) min = max = c.nominal;
    const recorded = valueOf(found.record, 'resistivity_temperature_coefficient');
    let alpha: PlanMaterial['alpha'];
    if (recorded)
      alpha = {
        nominal: recorded.nominal,
        low: recorded.min ?? recorded.nominal,
        high: recorded.max ?? recorded.nominal,
      };
    else {
      const element = mainElement(found.record);
      const base = element ? bases.get(element) : undefined;
      if (base) {
        const e = estimateAlpha(1 / c.nominal, base);
        alpha = { nominal: e.alphaPerK, low: e.lowPerK, high: e.highPerK };
      } else {
        alpha = { nominal: 0, low: 0, high: 0 };
        if (temperatureK.max > temperatureK.min || temperatureK.min !== c.referenceTemperatureK)
          note(
            'no-temperature-coefficient',
            slug,
            `${found.record.name} has no temperature coefficient in the table and none can be estimated from a base metal: its conductivity is taken as independent of temperature.`,
          );
      }
    }
    materials.push({
      label: slug,
      conductivity: { nominal: c.nominal, min, max },
      referenceTemperatureK: c.referenceTemperatureK,
      alpha,
      relativePermeability: found.record.relativePermeability,
    });
    bySlug.set(slug, materials.length - 1);
    return materials.length - 1;
  };

  const products: PlanProduct[] = body.products.map((p, i) => {
    const path = `/body/products/${i}`;
    if ('alloy' in p)
      return {
        name: p.name,
        layers: [{ material: alloyMaterial(p.alloy, `${path}/alloy`), thicknessM: null }],
      };
    let diameterM: number;
    let layers: PlanProduct['layers'];
    if ('stack' in p) {
      const stack = stacks.find((s) => s.slug === p.stack);
      if (!stack) throw invalid(`${path}/stack`, `no built-in stack '${p.stack}'`);
      diameterM = stack.diameterM;
      layers = stack.layers.map((l) => ({
        material: alloyMaterial(l.alloy, `${path}/stack`),
        thicknessM: l.thicknessM,
      }));
    } else {
      diameterM = siFromRequest('length', p.blank.diameter, `${path}/blank/diameter`);
      // Units, thicknesses and the half-space rule as the estimates check them.
      const resolved = sensorLayersFromRequest(p.blank.layers, `${path}/blank/layers`, table);
      layers = p.blank.layers.map((l, k) => {
        const thicknessM = resolved[k]!.thicknessM;
        if ('alloy' in l.material)
          return {
            material: alloyMaterial(l.material.alloy, `${path}/blank/layers/${k}/material/alloy`),
            thicknessM,
          };
        const m = resolveMaterial(l.material, `${path}/blank/layers/${k}/material`, table);
        const label = `layer ${k + 1} of ${p.name}`;
        materials.push({
          label,
          conductivity: {
            nominal: m.conductivitySPerM,
            min: m.conductivitySPerM,
            max: m.conductivitySPerM,
          },
          referenceTemperatureK: 293.15,
          alpha: { nominal: 0, low: 0, high: 0 },
          relativePermeability: m.relativePermeability,
        });
        if (temperatureK.max > temperatureK.min || temperatureK.min !== 293.15)
          note(
            'no-temperature-coefficient',
            label,
            `${label} is a conductivity of your own with no temperature coefficient: taken as independent of temperature, with no range.`,
          );
        return { material: materials.length - 1, thicknessM };
      });
    }
    const smallest = diameterM * (1 - diameterTolerance);
    if (smallest / 2 < EDGE_RADII * coil.outerRadiusM)
      note(
        'blank-edge',
        p.name,
        `${p.name} is ${Number((smallest * 1e3).toPrecision(3))} mm across at its smallest, under ${EDGE_RADII} outer radii of the coil (${Number((EDGE_RADII * coil.outerRadiusM * 2e3).toPrecision(3))} mm): the model takes it as a plate wider than the coil's field, and the edge will move the real reading.`,
      );
    return { name: p.name, layers };
  });

  const input: PlanInput = {
    coil,
    frequenciesHz,
    liftOffM,
    temperatureK,
    platingTolerance,
    materials,
    products,
    method,
  };
  const states = method.kind === 'monteCarlo' ? method.samples : cornersOf(input);
  const readings = products.length * frequenciesHz.length * states;
  if (readings > limits.readings)
    throw tooLarge(
      '/body',
      `This plan needs ${readings.toLocaleString('en')} readings (${products.length} products × ${frequenciesHz.length} frequencies × ${states} ${method.kind === 'monteCarlo' ? 'samples' : 'corners of the tolerance box'}); your role may ask for at most ${limits.readings.toLocaleString('en')}: fewer products, frequencies or samples.`,
    );
  return { input, warnings };
}

/** The most corners one product's tolerance box can have (an upper bound of the interval work). */
function cornersOf(input: PlanInput): number {
  let most = 1;
  for (const p of input.products) {
    const distinct = new Set(p.layers.map((l) => l.material)).size;
    most = Math.max(most, 2 ** (distinct + 3));
  }
  return most;
}

/** The engine's answer with the release in front, in the order openapi.yaml lists. */
export function answerOf(
  release: { version: string; checksum: string },
  result: PlanResult,
  warnings: PlanWarning[],
): SortPlanAnswer {
  return {
    release,
    frequencies: result.frequencies,
    recommendedFrequencyHz: result.recommendedFrequencyHz,
    recommendedPair: result.recommendedPair,
    warnings: [...warnings, ...result.warnings],
  };
}

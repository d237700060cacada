import { toMetres } from '../../../shared/units/length';
import type { LengthEntry, StackDraft } from '../../lib/stack-drafts';
import type { PlanRequest } from './api/evaluate-plan';

/** A product as the screen holds it: an alloy, a built-in stack, or a blank of the person's own. */
export type ProductEntry =
  | { name: string; kind: 'alloy'; alloy: string }
  | { name: string; kind: 'stack'; stack: string }
  | { name: string; kind: 'blank'; draft: StackDraft };

export interface PlanSettings {
  coil: { innerRadius: LengthEntry; outerRadius: LengthEntry; length: LengthEntry; turns: number };
  liftOffMin: LengthEntry;
  liftOffMax: LengthEntry;
  temperatureMinC: number;
  temperatureMaxC: number;
  fromKHz: number;
  toKHz: number;
  points: number;
  platingPercent: number;
  method: 'interval' | 'monteCarlo';
  samples: number;
  seed: number;
}

const mm = (value: number): LengthEntry => ({ value, unit: 'mm' });

/**
 * A small sensing coil under a coin rail (invented; 6 mm across, so that Estmark's 19–26.5 mm coins
 * are wider than three of its radii), the demo rail's ±0.05 mm of lift-off and a workshop's 15–35 °C.
 * 16 frequencies: within what a visitor may evaluate.
 */
export const defaultSettings: PlanSettings = {
  coil: { innerRadius: mm(1.5), outerRadius: mm(3), length: mm(2), turns: 100 },
  liftOffMin: mm(0.45),
  liftOffMax: mm(0.55),
  temperatureMinC: 15,
  temperatureMaxC: 35,
  fromKHz: 1,
  toKHz: 1000,
  points: 16,
  platingPercent: 10,
  method: 'interval',
  samples: 200,
  seed: 2026,
};

/** The demo scenario's coins (seeds/demo/estmark.ts, invented). */
export const demoCoins: ProductEntry[] = [
  { name: '1 mark', kind: 'stack', stack: 'estmark-1-mark' },
  { name: '2 marks', kind: 'stack', stack: 'estmark-2-marks' },
  { name: '5 marks', kind: 'stack', stack: 'estmark-5-marks' },
  { name: '10 marks', kind: 'stack', stack: 'estmark-10-marks' },
  { name: '20 marks', kind: 'stack', stack: 'estmark-20-marks' },
];

/**
 * Ridgeline Metals Recovery's mixed non-ferrous line (product.md, invented), each product as the
 * table alloy nearest what the line calls it; pieces thick against the skin depth.
 */
export const recyclerMix: ProductEntry[] = [
  { name: 'Shredded aluminium', kind: 'alloy', alloy: 'aluminium-6063-t6' },
  { name: 'Brass fittings', kind: 'alloy', alloy: 'free-cutting-brass-c36000' },
  { name: 'Copper wire nuggets', kind: 'alloy', alloy: 'copper-c11000' },
  { name: 'Zinc die-cast', kind: 'alloy', alloy: 'zinc-alloy-3' },
  { name: 'Stainless fines', kind: 'alloy', alloy: 'stainless-304' },
  { name: 'Lead', kind: 'alloy', alloy: 'lead' },
];

const quantity = (e: LengthEntry) => ({ value: e.value, unit: e.unit as 'mm' });

/** The settings' own problems, by field, in plain words (before anything is sent). */
export function settingsProblems(s: PlanSettings): Record<string, string> {
  const problems: Record<string, string> = {};
  const length = (key: string, e: LengthEntry, zeroOk = false) => {
    if (!Number.isFinite(e.value) || e.value < 0 || (!zeroOk && e.value === 0))
      problems[key] = zeroOk ? 'Enter a length of 0 or more.' : 'Enter a length above 0.';
  };
  length('coil.innerRadius', s.coil.innerRadius);
  length('coil.outerRadius', s.coil.outerRadius);
  length('coil.length', s.coil.length);
  length('liftOff.min', s.liftOffMin, true);
  length('liftOff.max', s.liftOffMax, true);
  if (!problems['liftOff.min'] && !problems['liftOff.max']) {
    const lo = toMetres(s.liftOffMin.value, s.liftOffMin.unit);
    const hi = toMetres(s.liftOffMax.value, s.liftOffMax.unit);
    if (hi < lo) problems['liftOff.max'] = 'The largest lift-off must not be below the smallest.';
  }
  if (!(s.temperatureMaxC >= s.temperatureMinC))
    problems['temperature.max'] = 'The highest temperature must not be below the lowest.';
  if (!(s.fromKHz > 0)) problems['frequencies.from'] = 'Enter a frequency above 0.';
  if (!(s.toKHz > s.fromKHz)) problems['frequencies.to'] = 'The sweep must end above its start.';
  if (!(Number.isInteger(s.points) && s.points >= 2 && s.points <= 64))
    problems['frequencies.points'] = 'Between 2 and 64 frequencies.';
  if (!Number.isInteger(s.coil.turns) || s.coil.turns < 1)
    problems['coil.turns'] = 'At least 1 turn.';
  return problems;
}

export function requestOf(products: ProductEntry[], s: PlanSettings): PlanRequest {
  return {
    products: products.map((p) => {
      if (p.kind === 'alloy') return { name: p.name, alloy: p.alloy };
      if (p.kind === 'stack') return { name: p.name, stack: p.stack };
      return {
        name: p.name,
        blank: {
          diameter: quantity(p.draft.diameter),
          layers: p.draft.layers.map((l) => ({
            material: { alloy: l.alloy },
            thickness: quantity(l.thickness),
          })),
        },
      };
    }),
    coil: {
      innerRadius: quantity(s.coil.innerRadius),
      outerRadius: quantity(s.coil.outerRadius),
      length: quantity(s.coil.length),
      turns: s.coil.turns,
    },
    frequencies: {
      from: { value: s.fromKHz, unit: 'kHz' },
      to: { value: s.toKHz, unit: 'kHz' },
      points: s.points,
    },
    liftOff: { min: quantity(s.liftOffMin), max: quantity(s.liftOffMax) },
    temperature: {
      min: { value: s.temperatureMinC, unit: 'C' },
      max: { value: s.temperatureMaxC, unit: 'C' },
    },
    tolerances: {
      conductivity: 'table',
      platingThicknessPercent: s.platingPercent,
      diameterPercent: 0,
    },
    method:
      s.method === 'interval'
        ? { kind: 'interval' }
        : { kind: 'monteCarlo', samples: s.samples, seed: s.seed },
  };
}

/** A saved plan's request back into the screen's state (what the screen itself saved). */
export function fromRequest(r: PlanRequest): { products: ProductEntry[]; settings: PlanSettings } {
  const products: ProductEntry[] = r.products.map((p) =>
    'alloy' in p
      ? { name: p.name, kind: 'alloy', alloy: p.alloy }
      : 'stack' in p
        ? { name: p.name, kind: 'stack', stack: p.stack }
        : {
            name: p.name,
            kind: 'blank',
            draft: {
              id: p.name,
              name: p.name,
              diameter: p.blank.diameter,
              layers: p.blank.layers.flatMap((l) =>
                'thickness' in l && 'alloy' in l.material
                  ? [{ alloy: l.material.alloy, thickness: l.thickness }]
                  : [],
              ),
            },
          },
  );
  const f = r.frequencies;
  const sweep = Array.isArray(f) ? null : f;
  const kHz = (q: { value: number; unit: string }) =>
    q.unit === 'MHz' ? q.value * 1000 : q.unit === 'Hz' ? q.value / 1000 : q.value;
  const celsius = (q: { value: number; unit: string }) =>
    q.unit === 'K'
      ? q.value - 273.15
      : q.unit === 'F' || q.unit === '°F'
        ? ((q.value - 32) * 5) / 9
        : q.value;
  return {
    products,
    settings: {
      coil: {
        innerRadius: r.coil.innerRadius,
        outerRadius: r.coil.outerRadius,
        length: r.coil.length,
        turns: r.coil.turns,
      },
      liftOffMin: r.liftOff.min,
      liftOffMax: r.liftOff.max,
      temperatureMinC: celsius(r.temperature.min),
      temperatureMaxC: celsius(r.temperature.max),
      fromKHz: sweep ? kHz(sweep.from) : defaultSettings.fromKHz,
      toKHz: sweep ? kHz(sweep.to) : defaultSettings.toKHz,
      points: sweep ? sweep.points : defaultSettings.points,
      platingPercent: r.tolerances?.platingThicknessPercent ?? 0,
      method: r.method.kind,
      samples: r.method.kind === 'monteCarlo' ? r.method.samples : defaultSettings.samples,
      seed: r.method.kind === 'monteCarlo' ? r.method.seed : defaultSettings.seed,
    },
  };
}

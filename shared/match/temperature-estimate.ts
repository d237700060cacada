import { valueOf, type AlloyRecord } from '../catalogue/alloy-record';

/** How a candidate's comparison was brought to the table's reference temperature. */
export interface TemperatureCorrection {
  kind: 'recorded' | 'estimated' | 'none';
  /** The coefficient used (the central one of an estimate), 1/K. */
  alphaPerK?: number;
  /** For an estimate, the rule and the bounds it gives. */
  rule?: string;
}

/** A pure base metal: its resistivity and temperature coefficient at 20 °C. */
export interface BaseMetal {
  element: string;
  resistivityOhmM: number;
  alphaPerK: number;
  /** Where the figures come from: a slug of the table, or a recalled handbook figure. */
  from: string;
}

/**
 * Base metals with no pure row carrying a located coefficient in the table (the table keeps only
 * coefficients a located source prints). Figures recalled, not re-checked, from the CRC Handbook's
 * table of the elements' resistivity and the common tables of coefficients: nickel ρ20 = 6.99
 * µΩ·cm, α20 = 0.0060 /K; titanium 42 µΩ·cm, 0.0038 /K; magnesium 4.4 µΩ·cm, 0.0040 /K. An
 * estimate from them is labelled "(recalled)" in its rule.
 */
const RECALLED_BASES: Record<string, BaseMetal> = {
  Ni: { element: 'Ni', resistivityOhmM: 6.99e-8, alphaPerK: 0.006, from: 'nickel (recalled)' },
  Ti: { element: 'Ti', resistivityOhmM: 42e-8, alphaPerK: 0.0038, from: 'titanium (recalled)' },
  Mg: { element: 'Mg', resistivityOhmM: 4.4e-8, alphaPerK: 0.004, from: 'magnesium (recalled)' },
};

/** A row counts as its element's pure metal from this purity on, mass %. */
const PURE_FROM_PERCENT = 99.5;

/**
 * Deviations from Matthiessen's rule in dilute alloys are positive and of order tens of percent of
 * the base metal's slope (Bass, Adv. Phys. 21, 431, 1972; recalled): the estimate's upper bound is
 * this factor times Matthiessen's value, never above the pure base metal's own α.
 */
export const DEVIATION_FACTOR = 1.5;

/** The element with the largest mass fraction of an alloy's nominal composition. */
export function mainElement(alloy: AlloyRecord): string | undefined {
  let best: string | undefined;
  let most = -Infinity;
  for (const [element, percent] of Object.entries(alloy.composition)) {
    if (percent > most) {
      most = percent;
      best = element;
    }
  }
  return best;
}

/**
 * The pure base metals the table itself describes: for each element, its purest row (at least
 * 99.5 % of it) that has a recorded temperature coefficient, plus the recalled figures above for
 * elements the table lacks.
 */
export function baseMetalsFrom(alloys: AlloyRecord[]): Map<string, BaseMetal> {
  const bases = new Map<string, BaseMetal & { purity: number }>();
  for (const alloy of alloys) {
    const element = mainElement(alloy);
    if (!element) continue;
    const purity = alloy.composition[element]!;
    const alpha = valueOf(alloy, 'resistivity_temperature_coefficient')?.nominal;
    const sigma = valueOf(alloy, 'conductivity')?.nominal;
    if (purity < PURE_FROM_PERCENT || alpha === undefined || !sigma) continue;
    const known = bases.get(element);
    if (known && known.purity >= purity) continue;
    bases.set(element, {
      element,
      resistivityOhmM: 1 / sigma,
      alphaPerK: alpha,
      from: alloy.slug,
      purity,
    });
  }
  const result = new Map<string, BaseMetal>();
  for (const [element, { purity: _purity, ...base }] of bases) result.set(element, base);
  for (const [element, base] of Object.entries(RECALLED_BASES)) {
    if (!result.has(element)) result.set(element, base);
  }
  return result;
}

/** An estimated coefficient with its bounds, 1/K. */
export interface AlphaEstimate {
  alphaPerK: number;
  lowPerK: number;
  highPerK: number;
  base: BaseMetal;
}

/**
 * Estimates the temperature coefficient of resistivity of an alloy that has none on record by
 * Matthiessen's rule: the alloy's resistivity is its base metal's thermal part plus a residual
 * part from solutes and defects that does not depend on temperature, so dρ/dT of the alloy ≈ dρ/dT
 * of the base metal and α_alloy ≈ α_base·ρ_base/ρ_alloy (Matthiessen 1864; e.g. Kittel,
 * Introduction to Solid State Physics, ch. 6; Rossiter, The Electrical Resistivity of Metals and
 * Alloys, 1987). That value is the lower bound; the upper bound allows for the positive deviations
 * from the rule ({@link DEVIATION_FACTOR}), capped at the base metal's own α. Not valid near a
 * Curie point; for copper-nickel and ferromagnetic alloys it is rougher still, which the bounds
 * carry into the score.
 *
 * @param alloyResistivityOhmM the alloy's resistivity at 20 °C, Ω·m
 * @example estimateAlpha(1 / (18.1 * 0.58e6), ni) // Ni 200 from nickel: α ≈ 0.0044 /K, up to 0.0060
 */
export function estimateAlpha(alloyResistivityOhmM: number, base: BaseMetal): AlphaEstimate {
  const matthiessen = (base.alphaPerK * base.resistivityOhmM) / alloyResistivityOhmM;
  const lowPerK = Math.min(matthiessen, base.alphaPerK);
  const highPerK = Math.min(DEVIATION_FACTOR * lowPerK, base.alphaPerK);
  return { alphaPerK: lowPerK, lowPerK, highPerK, base };
}

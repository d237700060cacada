/**
 * The reference table: metals and alloys with conductivity, density, the temperature coefficient of
 * resistivity where known, and relative permeability for the magnetic ones. Values at 20 °C.
 * Written in the units the handbooks use (%IACS or µΩ·cm, g/cm³); the seed converts to SI.
 * Source ids refer to ./sources.ts. Ranges cover the spread between handbooks and tempers. A
 * temperature coefficient is kept only where a located source prints it; Match estimates the rest
 * at run time (shared/match/temperature-estimate.ts) and says so.
 */
export type Family =
  | 'copper'
  | 'copper-zinc'
  | 'copper-nickel'
  | 'aluminium'
  | 'zinc'
  | 'nickel'
  | 'iron-steel'
  | 'precious'
  | 'other';

export type Triple = readonly [nominal: number, min: number, max: number];

export interface AlloySeed {
  slug: string;
  name: string;
  family: Family;
  uns: string | null;
  /**
   * Other names the trade uses for this alloy, for search (common practice, no source: trade
   * names and shop-floor usage, not handbook designations; Monel, Inconel and Zamak are trade
   * marks used generically).
   */
  aliases?: string[];
  /** Nominal composition, element → mass %. */
  composition: Record<string, number>;
  condition: string | null;
  /** Conductivity as %IACS or as resistivity in µΩ·cm, whichever the source gives. */
  conductivity: { iacs: Triple } | { uohmCm: Triple };
  conductivitySource: number;
  densityGPerCm3: Triple;
  densitySource: number;
  /** Temperature coefficient of resistivity at 20 °C, 1/K. */
  alpha?: { value: number; source: number };
  magnetic?: { relativePermeability: Triple; source: number };
  notes?: string;
}

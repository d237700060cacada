/**
 * What a located source says about one value of the table: the figure as the document prints it,
 * in its own unit, with where it stands in the document. The seed's nominal value must agree with
 * it once converted (tests/unit/citations.test.ts), so a seed and its source cannot drift apart.
 */
export type QuotedQuantity =
  'conductivity' | 'density' | 'resistivity_temperature_coefficient' | 'relative_permeability';

/** Units the sources print; the test converts each to the table's SI unit. */
export type QuotedUnit =
  | '%IACS'
  | 'MS/m'
  | 'uohm.cm'
  | 'nohm.m'
  | 'ohm.cmil/ft'
  | 'g/cm3'
  | 'kg/m3'
  | 'lb/in3'
  | '1/K'
  | '1/degF'
  | '1';

export interface QuotedFigure {
  /** The alloy's slug in the table. */
  slug: string;
  quantity: QuotedQuantity;
  /** The source row (sources-*.ts) this figure was read from. */
  sourceId: number;
  /** Where in the document: table, page, section or the page's own heading. */
  where: string;
  /** The figure as printed, in `unit`. */
  value: number;
  unit: QuotedUnit;
  /** Temperature the source states for the figure, °C (68 °F = 20 °C); omitted when it gives none. */
  temperatureC?: number;
  /** Temper or condition the source states, when the figure depends on it. */
  temper?: string;
  /**
   * Allowed relative difference between the seed's nominal and this figure; 0.01 unless given.
   * Anything wider must say why in `note` (a different temperature, a range's midpoint…).
   */
  tolerance?: number;
  note?: string;
}

/** An alloy as the reference table holds it, SI values inside. Shared by the services and tests. */
export type SourceKind = 'handbook' | 'standard' | 'paper' | 'measurement_set' | 'from_memory';

export interface SourceRecord {
  id: number;
  citation: string;
  kind: SourceKind;
  locator: string | null;
  url: string | null;
}

export type QuantityName =
  'conductivity' | 'density' | 'resistivity_temperature_coefficient' | 'relative_permeability';

export interface PropertyValueRecord {
  quantity: QuantityName;
  nominal: number;
  min: number | null;
  max: number | null;
  /** SI unit of nominal, min and max: S/m, kg/m3, 1/K or 1. */
  unit: string;
  referenceTemperatureK: number;
  condition: string | null;
  source: SourceRecord;
  /**
   * What the located source prints for this value, as a plain line ("Table 2: 28 %IACS at 20 °C
   * (annealed)"); null for a value from memory or one a curator changed. Absent in release
   * snapshots made before quotes were stored.
   */
  quoted?: string | null;
}

export interface AlloyRecord {
  id: number;
  slug: string;
  name: string;
  family: string;
  uns: string | null;
  /**
   * Other names the trade uses ("Muntz metal", "German silver"), for search. Absent in release
   * snapshots made before aliases were stored.
   */
  aliases?: string[];
  magnetic: boolean;
  relativePermeability: number;
  composition: Record<string, number>;
  condition: string | null;
  notes: string | null;
  status: 'published' | 'draft';
  values: PropertyValueRecord[];
}

export function valueOf(
  alloy: AlloyRecord,
  quantity: QuantityName,
): PropertyValueRecord | undefined {
  return alloy.values.find((v) => v.quantity === quantity);
}

/**
 * True when the alloy's headline figures (conductivity or density) rest on a citation nobody has
 * re-checked; the Alloy sheet flags every other value one by one.
 */
export function restsOnMemory(alloy: AlloyRecord): boolean {
  return alloy.values.some(
    (v) =>
      (v.quantity === 'conductivity' || v.quantity === 'density') &&
      v.source.kind === 'from_memory',
  );
}

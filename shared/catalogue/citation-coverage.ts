import type { AlloyRecord, QuantityName, SourceKind } from './alloy-record';

/**
 * How much of the reference table rests on a located document. One count for the three places
 * that show it (`npm run table:report`, GET /api/v1/checks and its test), so they cannot disagree.
 */

export const COVERAGE_QUANTITIES: readonly QuantityName[] = [
  'conductivity',
  'density',
  'resistivity_temperature_coefficient',
  'relative_permeability',
];

export const SOURCE_KINDS: readonly SourceKind[] = [
  'handbook',
  'standard',
  'paper',
  'measurement_set',
  'from_memory',
];

/** One value of the table and the kind of its source; `kind: null` when no source row exists. */
export interface CitedValue {
  slug: string;
  quantity: QuantityName;
  sourceId: number;
  kind: SourceKind | null;
}

export interface CoverageCount {
  /** Values counted. */
  values: number;
  /** Values whose source is a located document (any kind but from_memory). */
  cited: number;
  /** Values whose citation names where the figure is usually found but was not re-checked. */
  fromMemory: number;
  byKind: Record<SourceKind, number>;
}

export interface CitationCoverage extends CoverageCount {
  byQuantity: Record<QuantityName, CoverageCount>;
  /** The values not located (from_memory), in table order. */
  notLocated: CitedValue[];
  /** Values whose source id has no source row: the table is broken where there are any. */
  unsourced: CitedValue[];
}

function emptyCount(): CoverageCount {
  return {
    values: 0,
    cited: 0,
    fromMemory: 0,
    byKind: Object.fromEntries(SOURCE_KINDS.map((k) => [k, 0])) as Record<SourceKind, number>,
  };
}

function add(count: CoverageCount, kind: SourceKind | null): void {
  count.values += 1;
  if (kind === null) return;
  count.byKind[kind] += 1;
  if (kind === 'from_memory') count.fromMemory += 1;
  else count.cited += 1;
}

/**
 * Counts values by the kind of their source, overall and per quantity, and lists the values not
 * located and those with no source row. A value without a source row counts in `values` only.
 * @example citationCoverage([{ slug: 'copper-c11000', quantity: 'density', sourceId: 6, kind: 'from_memory' }])
 * // { values: 1, cited: 0, fromMemory: 1, byKind: { …, from_memory: 1 }, … }
 */
export function citationCoverage(values: readonly CitedValue[]): CitationCoverage {
  const total = emptyCount();
  const byQuantity = Object.fromEntries(
    COVERAGE_QUANTITIES.map((q) => [q, emptyCount()]),
  ) as Record<QuantityName, CoverageCount>;
  const notLocated: CitedValue[] = [];
  const unsourced: CitedValue[] = [];
  for (const v of values) {
    add(total, v.kind);
    add(byQuantity[v.quantity], v.kind);
    if (v.kind === 'from_memory') notLocated.push(v);
    if (v.kind === null) unsourced.push(v);
  }
  return { ...total, byQuantity, notLocated, unsourced };
}

/** The values of the live table (published alloys as the catalogue holds them). */
export function citedValuesOf(records: readonly AlloyRecord[]): CitedValue[] {
  return records.flatMap((r) =>
    r.values.map((v) => ({
      slug: r.slug,
      quantity: v.quantity,
      sourceId: v.source.id,
      kind: v.source.kind,
    })),
  );
}

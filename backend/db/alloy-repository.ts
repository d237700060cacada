import type { Knex } from 'knex';
import type {
  AlloyRecord,
  PropertyValueRecord,
  QuantityName,
  SourceKind,
} from '../../shared/catalogue/alloy-record';

interface AlloyRow {
  id: number;
  slug: string;
  name: string;
  family: string;
  uns: string | null;
  magnetic: number | boolean;
  relative_permeability: number;
  composition_json: string;
  aliases_json: string;
  condition: string | null;
  notes: string | null;
  status: 'published' | 'draft';
}

interface ValueRow {
  alloy_id: number;
  quantity: QuantityName;
  nominal: number;
  min: number | null;
  max: number | null;
  unit: string;
  reference_temperature_k: number;
  condition: string | null;
  source_id: number;
  quoted: string | null;
  citation: string;
  kind: SourceKind;
  locator: string | null;
  url: string | null;
}

export interface AlloyRepository {
  /** Every published alloy with its values and their sources, in id order. */
  listPublished(): Promise<AlloyRecord[]>;
}

export function createAlloyRepository(knex: Knex): AlloyRepository {
  return {
    async listPublished() {
      const alloys = (await knex('alloys')
        .where({ status: 'published' })
        .orderBy('id')) as AlloyRow[];
      const values = (await knex('property_values as v')
        .join('sources as s', 's.id', 'v.source_id')
        .select('v.*', 's.citation', 's.kind', 's.locator', 's.url')
        .orderBy('v.id')) as ValueRow[];
      const byAlloy = new Map<number, PropertyValueRecord[]>();
      for (const v of values) {
        const list = byAlloy.get(v.alloy_id) ?? [];
        list.push({
          quantity: v.quantity,
          nominal: v.nominal,
          min: v.min,
          max: v.max,
          unit: v.unit,
          referenceTemperatureK: v.reference_temperature_k,
          condition: v.condition,
          source: {
            id: v.source_id,
            citation: v.citation,
            kind: v.kind,
            locator: v.locator,
            url: v.url,
          },
          quoted: v.quoted,
        });
        byAlloy.set(v.alloy_id, list);
      }
      return alloys.map((a) => ({
        id: a.id,
        slug: a.slug,
        name: a.name,
        family: a.family,
        uns: a.uns,
        aliases: JSON.parse(a.aliases_json) as string[],
        magnetic: Boolean(a.magnetic),
        relativePermeability: a.relative_permeability,
        composition: JSON.parse(a.composition_json) as Record<string, number>,
        condition: a.condition,
        notes: a.notes,
        status: a.status,
        values: byAlloy.get(a.id) ?? [],
      }));
    },
  };
}

import type { Knex } from 'knex';

export interface ReadingRecord {
  id: number;
  label: string;
  site: string;
  product: string;
  conductivitySPerM: number;
  frequencyHz: number | null;
  temperatureK: number;
  densityKgPerM3: number | null;
  massKg: number | null;
  invented: boolean;
}

export interface ReadingRepository {
  list(): Promise<ReadingRecord[]>;
}

export function createReadingRepository(knex: Knex): ReadingRepository {
  return {
    async list() {
      const rows = await knex('readings').orderBy('id');
      return rows.map((r) => ({
        id: r.id,
        label: r.label,
        site: r.site,
        product: r.product,
        conductivitySPerM: r.conductivity_s_per_m,
        frequencyHz: r.frequency_hz,
        temperatureK: r.temperature_k,
        densityKgPerM3: r.density_kg_per_m3,
        massKg: r.mass_kg,
        invented: Boolean(r.invented),
      }));
    },
  };
}

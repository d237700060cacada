import type { Knex } from 'knex';
import { demoReadings, demoStacks } from './demo/estmark';

/**
 * The invented demo scenario (product.md): the Republic of Estmark's five coins from the
 * Carrow Bay Mint as built-in stacks, and readings from the Ridgeline Metals Recovery line.
 * Everything here is invented; it is kept apart from the reference table.
 */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    await trx('stacks').where({ built_in: true }).del();
    await trx('readings').where({ invented: true }).del();
    await trx('stacks').insert(
      demoStacks.map((s, i) => ({
        id: i + 1,
        slug: s.slug,
        name: s.name,
        description: s.description,
        diameter_m: s.diameterM,
        layers_json: JSON.stringify(s.layers),
        mass_kg: null,
        built_in: true,
        invented: true,
      })),
    );
    await trx('readings').insert(
      demoReadings.map((r, i) => ({
        id: i + 1,
        label: r.label,
        site: r.site,
        product: r.product,
        conductivity_s_per_m: r.conductivitySPerM,
        frequency_hz: r.frequencyHz,
        temperature_k: r.temperatureK,
        density_kg_per_m3: r.densityKgPerM3,
        mass_kg: r.massKg,
        invented: true,
      })),
    );
  });
}

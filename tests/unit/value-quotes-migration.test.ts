import { describe, expect, it, vi } from 'vitest';
import { createKnex } from '../../backend/db/knex';
import { sources } from '../../seeds/reference/sources';

// Two figures as a curator of the data would write them: one for a value that still cites its
// document, one for a value whose source row was replaced by a different document with the same id.
vi.mock('../../seeds/reference/quoted-figures', () => ({
  quotedFigures: [
    {
      slug: 'cartridge-brass-c26000',
      quantity: 'conductivity',
      sourceId: 2,
      where: 'C26000',
      value: 28,
      unit: '%IACS',
      temperatureC: 20,
    },
    {
      slug: 'cartridge-brass-c26000',
      quantity: 'density',
      sourceId: 3,
      where: 'physical properties',
      value: 0.308,
      unit: 'lb/in3',
      temperatureC: 20,
    },
  ],
}));

describe('migration 20261202090000_add_value_quotes', () => {
  it('quotes the values of an existing table that still cite the same document, and no other', async () => {
    const knex = createKnex(':memory:');
    await knex.migrate.up({ name: '20261201120000_create_reference_table' });
    await knex('sources').insert([
      { ...sources.find((s) => s.id === 2)! },
      // Same id as reference source 3, another document: its value must not get source 3's quote.
      { id: 3, citation: 'A curator’s own source', kind: 'handbook', locator: null, url: null },
    ]);
    await knex('alloys').insert({
      id: 1,
      slug: 'cartridge-brass-c26000',
      name: 'Cartridge brass',
      family: 'copper-zinc',
    });
    const row = { alloy_id: 1, unit: 'x', reference_temperature_k: 293.15, nominal: 1 };
    await knex('property_values').insert([
      { ...row, id: 1, quantity: 'conductivity', source_id: 2 },
      { ...row, id: 2, quantity: 'density', source_id: 3 },
    ]);
    await knex.migrate.latest();
    const quoted = await knex('property_values').orderBy('id').pluck('quoted');
    expect(quoted).toEqual(['C26000: 28 %IACS at 20 °C', null]);
    await knex.migrate.rollback(undefined, true);
    await knex.destroy();
  });
});

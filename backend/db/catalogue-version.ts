import type { Knex } from 'knex';

/** The catalogue's version: bumped in the transaction that changes the published table. */
export async function catalogueVersion(knex: Knex): Promise<number> {
  const row = (await knex('catalogue_version').where({ id: 1 }).first('version')) as
    { version: number } | undefined;
  return Number(row?.version ?? 0);
}

export async function bumpCatalogueVersion(trx: Knex.Transaction): Promise<void> {
  await trx('catalogue_version').where({ id: 1 }).increment('version', 1);
}

import type { Knex } from 'knex';

export interface SortPlanRow {
  id: number;
  ownerId: number;
  name: string;
  inputs: unknown;
  release: { version: string; checksum: string };
  resultJson: string;
  resultSha256: string;
  createdAt: string;
}

export interface SortPlanRepository {
  insert(row: Omit<SortPlanRow, 'id'>): Promise<number>;
  /** The owner's plans, newest first. */
  listOwned(ownerId: number): Promise<SortPlanRow[]>;
  /** The plan if this owner has it; someone else's plan is as absent as a missing one. */
  findOwned(id: number, ownerId: number): Promise<SortPlanRow | undefined>;
  deleteOwned(id: number, ownerId: number): Promise<boolean>;
}

function fromRow(r: Record<string, unknown>): SortPlanRow {
  return {
    id: r.id as number,
    ownerId: r.owner_id as number,
    name: r.name as string,
    inputs: JSON.parse(r.inputs_json as string),
    release: { version: r.release_version as string, checksum: r.release_checksum as string },
    resultJson: r.result_json as string,
    resultSha256: r.result_sha256 as string,
    createdAt: r.created_at as string,
  };
}

export function createSortPlanRepository(knex: Knex): SortPlanRepository {
  return {
    async insert(plan) {
      // RETURNING gives the new id on both SQLite and PostgreSQL (a bare insert returns none on
      // PostgreSQL).
      const [row] = await knex('sort_plans')
        .insert({
          owner_id: plan.ownerId,
          name: plan.name,
          inputs_json: JSON.stringify(plan.inputs),
          release_version: plan.release.version,
          release_checksum: plan.release.checksum,
          result_json: plan.resultJson,
          result_sha256: plan.resultSha256,
          created_at: plan.createdAt,
        })
        .returning('id');
      return (row as { id: number }).id;
    },
    async listOwned(ownerId) {
      const rows = await knex('sort_plans').where({ owner_id: ownerId }).orderBy('id', 'desc');
      return rows.map(fromRow);
    },
    async findOwned(id, ownerId) {
      const row = await knex('sort_plans').where({ id, owner_id: ownerId }).first();
      return row ? fromRow(row) : undefined;
    },
    async deleteOwned(id, ownerId) {
      return (await knex('sort_plans').where({ id, owner_id: ownerId }).delete()) > 0;
    },
  };
}

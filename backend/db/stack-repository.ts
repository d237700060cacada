import type { Knex } from 'knex';

export interface StackRecord {
  slug: string;
  name: string;
  description: string;
  diameterM: number;
  layers: Array<{ alloy: string; thicknessM: number }>;
  invented: boolean;
}

export interface StackRepository {
  listBuiltIn(): Promise<StackRecord[]>;
}

export function createStackRepository(knex: Knex): StackRepository {
  return {
    async listBuiltIn() {
      const rows = await knex('stacks').where({ built_in: true }).orderBy('id');
      return rows.map((r) => ({
        slug: r.slug,
        name: r.name,
        description: r.description ?? '',
        diameterM: r.diameter_m,
        layers: JSON.parse(r.layers_json) as StackRecord['layers'],
        invented: Boolean(r.invented),
      }));
    },
  };
}

import type { Knex } from 'knex';
import * as createReferenceTable from '../../migrations/20261201120000_create_reference_table';
import * as createStacksAndReadings from '../../migrations/20261201120100_create_stacks_and_readings';
import * as createAccounts from '../../migrations/20261201130000_create_accounts';
import * as createCuration from '../../migrations/20261201140000_create_curation';
import * as addAlloyAliases from '../../migrations/20261201230000_add_alloy_aliases';
import * as createSharedState from '../../migrations/20261202010000_create_shared_state';
import * as addValueQuotes from '../../migrations/20261202090000_add_value_quotes';
import * as createSortPlans from '../../migrations/20261202100000_create_sort_plans';

/**
 * Migrations listed statically: Knex's directory loading cannot import .ts files under vitest,
 * and a static list also makes the bundle of migrations explicit. Add each new file here
 * (tests/unit/migrations.test.ts fails when one in migrations/ is missing).
 */
export const migrations: Record<string, Knex.Migration> = {
  '20261201120000_create_reference_table': createReferenceTable,
  '20261201120100_create_stacks_and_readings': createStacksAndReadings,
  '20261201130000_create_accounts': createAccounts,
  '20261201140000_create_curation': createCuration,
  '20261201230000_add_alloy_aliases': addAlloyAliases,
  '20261202010000_create_shared_state': createSharedState,
  '20261202090000_add_value_quotes': addValueQuotes,
  '20261202100000_create_sort_plans': createSortPlans,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const migration = migrations[name];
    if (!migration) throw new Error(`unknown migration ${name}`);
    return migration;
  },
};

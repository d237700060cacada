import type { Knex } from 'knex';
import * as referenceTable from '../../seeds/01_reference_table';
import * as demoScenario from '../../seeds/02_demo_scenario';
import * as demoAccounts from '../../seeds/03_demo_accounts';

/** Seeds, kept apart so a deployment can load the reference table without the demo. */
export const referenceSeeds: Array<(knex: Knex) => Promise<void>> = [referenceTable.seed];
export const demoSeeds: Array<(knex: Knex) => Promise<void>> = [demoScenario.seed];
/** Known passwords: local use only (the seed itself refuses production). */
export const demoAccountSeeds: Array<(knex: Knex) => Promise<void>> = [demoAccounts.seed];

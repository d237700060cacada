import type { Knex } from 'knex';
import * as referenceTable from '../../seeds/01_reference_table';
import * as demoScenario from '../../seeds/02_demo_scenario';

/** Seeds, kept apart so a deployment can load the reference table without the demo. */
export const referenceSeeds: Array<(knex: Knex) => Promise<void>> = [referenceTable.seed];
export const demoSeeds: Array<(knex: Knex) => Promise<void>> = [demoScenario.seed];

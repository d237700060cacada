import type { SourceRow } from './sources-base';

/** Located documents for pure metals, aluminium, zinc, nickel, iron and steel, the rest: ids 200–299. */
export const generalSources: SourceRow[] = [];

import type { SourceRow } from './sources-base';

/** Located documents for coppers, copper alloys and precious-metal alloys: ids 100–199. */
export const copperSources: SourceRow[] = [];

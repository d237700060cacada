import { baseSources } from './sources-base';
import { copperSources } from './sources-copper';
import { generalSources } from './sources-general';

export type { SourceRow } from './sources-base';

/** Every citation behind the reference table, one row per document. */
export const sources = [...baseSources, ...copperSources, ...generalSources];

import { copperFigures } from './quoted-figures-copper';
import { generalFigures } from './quoted-figures-general';

export type { QuotedFigure, QuotedQuantity, QuotedUnit } from './quoted-figure';

/** Every figure read from a located source, for the seed's values to be checked against. */
export const quotedFigures = [...copperFigures, ...generalFigures];

import type { QuotedFigure } from './quoted-figure';

/** Figures as printed in the general sources (sources-general.ts and the located base sources). */
export const generalFigures: QuotedFigure[] = [];

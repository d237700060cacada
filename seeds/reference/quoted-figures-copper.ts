import type { QuotedFigure } from './quoted-figure';

/** Figures as printed in the copper sources (sources-copper.ts and the located base sources). */
export const copperFigures: QuotedFigure[] = [];

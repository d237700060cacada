import { seriesColours } from '../../../lib/chart-format';

/**
 * Colours for up to twelve products: the shared four, then eight more of ours, each dark enough
 * (4.5:1 or more on white) to colour a product's name as text.
 */
export const planColours = [
  ...seriesColours,
  '#7a3b69',
  '#2f6b2a',
  '#8a4b08',
  '#245f86',
  '#6b5d4f',
  '#9b2f3a',
  '#4d4d8f',
  '#3d6f6a',
];

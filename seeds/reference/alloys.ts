/**
 * The reference table: metals and alloys with conductivity, density, the temperature coefficient of
 * resistivity where known, and relative permeability for the magnetic ones. Values at 20 °C.
 * Kept in two files so that the copper family and the rest can be curated apart.
 */
import { copperAlloys } from './alloys-copper';
import { generalAlloys } from './alloys-general';

export type { AlloySeed, Family, Triple } from './alloy-seed';

export const alloys = [...generalAlloys, ...copperAlloys];

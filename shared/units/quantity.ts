import { toFarads, toOhms, toVolts } from './circuit';
import { toSiemensPerMetre } from './conductivity';
import { toKilogramsPerCubicMetre } from './density';
import { toHertz } from './frequency';
import { toMetres } from './length';
import { toKelvin } from './temperature';

/** A value a person or an instrument gives, with the unit it was given in. */
export interface Quantity {
  value: number;
  unit: string;
}

export type QuantityKind =
  | 'conductivity'
  | 'length'
  | 'density'
  | 'temperature'
  | 'frequency'
  | 'capacitance'
  | 'voltage'
  | 'resistance';

const toSI: Record<QuantityKind, (value: number, unit: string) => number> = {
  conductivity: toSiemensPerMetre,
  length: toMetres,
  density: toKilogramsPerCubicMetre,
  temperature: toKelvin,
  frequency: toHertz,
  capacitance: toFarads,
  voltage: toVolts,
  resistance: toOhms,
};

/** The SI value (S/m, m, kg/m³, K, Hz) of a quantity of the given kind. */
export function quantityToSI(kind: QuantityKind, quantity: Quantity): number {
  return toSI[kind](quantity.value, quantity.unit);
}

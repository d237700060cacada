/**
 * Unit codes accepted at the edges of the API and the UI, per kind of quantity.
 * The ASCII code is canonical; the Unicode spellings a person types (µΩ·cm, µm, °C) are aliases.
 * openapi.yaml lists the same codes; tests/unit/units-codes.test.ts keeps the two in step.
 */
export const conductivityUnits = ['S/m', 'MS/m', '%IACS'] as const;
export const resistivityUnits = ['ohm_m', 'uohm_cm', 'nohm_m'] as const;
export const lengthUnits = ['m', 'mm', 'um', 'in', 'mil'] as const;
export const densityUnits = ['kg/m3', 'g/cm3', 'lb/in3'] as const;
export const temperatureUnits = ['C', 'K', 'F'] as const;
export const frequencyUnits = ['Hz', 'kHz', 'MHz'] as const;

export const capacitanceUnits = ['F', 'uF'] as const;
export const voltageUnits = ['V', 'kV'] as const;
export const resistanceUnits = ['ohm', 'mohm'] as const;

export type ConductivityUnit = (typeof conductivityUnits)[number];
export type ResistivityUnit = (typeof resistivityUnits)[number];
export type LengthUnit = (typeof lengthUnits)[number];
export type DensityUnit = (typeof densityUnits)[number];
export type TemperatureUnit = (typeof temperatureUnits)[number];
export type FrequencyUnit = (typeof frequencyUnits)[number];

/** Unicode spellings people type, mapped to the canonical code. */
export const unitAliases: Readonly<Record<string, string>> = {
  'µΩ·cm': 'uohm_cm',
  'μΩ·cm': 'uohm_cm',
  'µohm·cm': 'uohm_cm',
  'Ω·m': 'ohm_m',
  'nΩ·m': 'nohm_m',
  µm: 'um',
  μm: 'um',
  µF: 'uF',
  μF: 'uF',
  Ω: 'ohm',
  mΩ: 'mohm',
  '°C': 'C',
  '°F': 'F',
  'kg/m³': 'kg/m3',
  'g/cm³': 'g/cm3',
  'lb/in³': 'lb/in3',
};

/** Every alias that resolves to one of the given canonical codes. */
export function aliasesOf(codes: readonly string[]): string[] {
  return Object.entries(unitAliases)
    .filter(([, canonical]) => codes.includes(canonical))
    .map(([alias]) => alias);
}

/** The canonical code for a unit as given, or the input unchanged when it is no alias. */
export function canonicalUnit(unit: string): string {
  return unitAliases[unit] ?? unit;
}

/** How each canonical code is written for people. */
export const unitLabels: Readonly<Record<string, string>> = {
  'S/m': 'S/m',
  'MS/m': 'MS/m',
  '%IACS': '%IACS',
  ohm_m: 'Ω·m',
  uohm_cm: 'µΩ·cm',
  nohm_m: 'nΩ·m',
  m: 'm',
  mm: 'mm',
  um: 'µm',
  in: 'in',
  mil: 'mil',
  'kg/m3': 'kg/m³',
  'g/cm3': 'g/cm³',
  'lb/in3': 'lb/in³',
  C: '°C',
  K: 'K',
  F: '°F',
  Hz: 'Hz',
  kHz: 'kHz',
  MHz: 'MHz',
  // 'F' is °F here; a farad is labelled by the capacitance field itself (see capacitanceLabel).
  uF: 'µF',
  V: 'V',
  kV: 'kV',
  ohm: 'Ω',
  mohm: 'mΩ',
  // Pulse ratings, flux density and power (shared/units/pulse-ratings.ts).
  A: 'A',
  kA: 'kA',
  A2s: 'A²s',
  kA2s: 'kA²s',
  T: 'T',
  mT: 'mT',
  W: 'W',
  kW: 'kW',
};

/** Capacitance codes for people: 'F' means farad only in a capacitance field. */
export function capacitanceLabel(unit: string): string {
  return canonicalUnit(unit) === 'uF' ? 'µF' : 'F';
}

export function unitLabel(unit: string): string {
  return unitLabels[canonicalUnit(unit)] ?? unit;
}

import {
  fromSiemensPerMetre,
  isResistivityUnit,
  percentIacs,
} from '../../shared/units/conductivity';
import { unitLabel } from '../../shared/units/codes';
import { fromKilogramsPerCubicMetre, toKilogramsPerCubicMetre } from '../../shared/units/density';
import type { UnitPreferences } from './unit-preferences';

/**
 * The one place numbers become text. Every figure a person reads goes through formatNumber
 * (significant figures, × 10ⁿ for very large or small magnitudes, never "e+3") and carries its
 * unit; conductivity and density follow the person's choice (unit-preferences.ts).
 */

const superscripts: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/**
 * A figure to `digits` significant figures, trailing zeros kept (28.0 says more than 28); very
 * large or small magnitudes as a × 10ⁿ. Between 10^digits and 10⁵ the figure is written whole
 * (2260, not toPrecision's "2.26e+3").
 */
export function formatNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e5 || abs < 1e-3)) {
    const [mantissa, exponent = '0'] = value.toExponential(digits - 1).split('e');
    const power = String(Number(exponent)).replace(/./g, (c) => superscripts[c] ?? c);
    return `${mantissa} × 10${power}`;
  }
  if (abs !== 0 && Math.floor(Math.log10(abs)) >= digits - 1)
    return String(Math.round(Number(value.toPrecision(digits))));
  return value.toPrecision(digits);
}

/** A chart tick: the same style as formatNumber, without trailing zeros (20, not 20.0). */
export function formatTick(value: number, digits = 3): string {
  const text = formatNumber(value, digits);
  return text.replace(/^(-?\d+)\.(\d*?)0+(?=$| ×)/, (_, whole: string, rest: string) =>
    rest ? `${whole}.${rest}` : whole,
  );
}

/** A figure for a form field: plain digits a person can edit, no exponent, no trailing zeros. */
export function formatEditable(value: number, digits = 4): string {
  const rounded = Number(value.toPrecision(digits));
  const text = String(rounded);
  if (!/e/i.test(text)) return text;
  // Very large or small: spell the digits out so the box never shows an exponent.
  return Math.abs(rounded) >= 1
    ? rounded.toLocaleString('en-US', { useGrouping: false, maximumFractionDigits: 0 })
    : rounded.toLocaleString('en-US', { useGrouping: false, maximumSignificantDigits: digits });
}

/** A value with its unit's label, e.g. "2260 A". */
export function formatWithUnit(value: number, unit: string, digits = 3): string {
  return `${formatNumber(value, digits)} ${unitLabel(unit)}`;
}

/** 'Resistivity' when the unit is a resistivity unit (µΩ·cm, nΩ·m, Ω·m), else 'Conductivity'. */
export function conductivityQuantityName(unit: string): 'Conductivity' | 'Resistivity' {
  return isResistivityUnit(unit) ? 'Resistivity' : 'Conductivity';
}

/** A conductivity (S/m) in the chosen conductivity or resistivity unit, with its label. */
export function formatConductivity(sPerM: number, unit: string): string {
  if (!Number.isFinite(sPerM) || sPerM <= 0) return '—';
  return `${formatNumber(fromSiemensPerMetre(sPerM, unit))} ${unitLabel(unit)}`;
}

/** A conductivity in the chosen unit, no label (chart values, editable boxes). */
export function conductivityIn(sPerM: number, unit: string): number {
  return fromSiemensPerMetre(sPerM, unit);
}

export function formatDensity(kgPerM3: number, unit: string): string {
  return `${formatNumber(fromKilogramsPerCubicMetre(kgPerM3, unit), unit === 'kg/m3' ? 4 : 3)} ${unitLabel(unit)}`;
}

/** A conductivity range in the chosen unit; a resistivity unit swaps its ends. */
export function formatConductivityRange(min: number, max: number, unit: string): string {
  const ends = [fromSiemensPerMetre(min, unit), fromSiemensPerMetre(max, unit)].sort(
    (a, b) => a - b,
  );
  return `${formatNumber(ends[0]!)}–${formatNumber(ends[1]!)} ${unitLabel(unit)}`;
}

export function formatDensityRange(min: number, max: number, unit: string): string {
  const digits = unit === 'kg/m3' ? 4 : 3;
  return `${formatNumber(fromKilogramsPerCubicMetre(min, unit), digits)}–${formatNumber(fromKilogramsPerCubicMetre(max, unit), digits)} ${unitLabel(unit)}`;
}

/** %IACS of a conductivity in S/m, as text with its unit. */
export function formatPercentIacs(sPerM: number): string {
  return `${formatNumber(percentIacs(sPerM))} %IACS`;
}

/** A frequency in Hz, kHz or MHz. */
export function formatFrequency(hz: number): string {
  if (hz >= 1e6) return `${formatTick(hz / 1e6)} MHz`;
  if (hz >= 1e3) return `${formatTick(hz / 1e3)} kHz`;
  return `${formatTick(hz)} Hz`;
}

const SI_PREFIXES: Array<[number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/**
 * A value of an SI unit that takes prefixes (H, Ω, m, S/m, H/m, J) with the prefix that puts its
 * figure between 1 and 1000: 0.2259 H → "225.9 mH" with digits 4. Not for kg/m³ or %IACS.
 */
export function formatSiPrefixed(value: number, unit: string, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  // A pure number ('1': a ratio, a magnetization per unit field) takes no prefix and no unit.
  if (unit === '1') return formatNumber(value, digits);
  const abs = Math.abs(value);
  const [scale, prefix] =
    abs === 0
      ? [1, '']
      : (SI_PREFIXES.find(([s]) => abs >= s * (1 - 1e-12)) ?? SI_PREFIXES.at(-1)!);
  return `${formatNumber(value / scale, digits)} ${prefix}${unitLabel(unit)}`;
}

/** A relative difference or tolerance as a percentage: 3.9e-4 → "0.039 %", 2e-15 → "2.0 × 10⁻¹³ %". */
export function formatRelativePercent(ratio: number, digits = 2): string {
  if (ratio === 0) return '0 %';
  return `${formatTick(ratio * 100, digits)} %`;
}

/** A part of a whole as a percentage to one decimal ("6.0 %"), so a column of shares lines up. */
export function formatShare(part: number, whole: number): string {
  if (whole === 0) return '—';
  return `${((100 * part) / whole).toFixed(1)} %`;
}

/** A length in metres, in m, mm or µm as its size suits, to three significant figures. */
export function formatLength(m: number): string {
  if (!Number.isFinite(m)) return '—';
  const abs = Math.abs(m);
  if (abs >= 1) return `${formatNumber(m)} m`;
  if (abs >= 1e-3) return `${formatNumber(m * 1e3)} mm`;
  return `${formatNumber(m * 1e6)} µm`;
}

/**
 * σ/ρ, conductivity over density, in the chosen units; a resistivity choice reads it in MS/m
 * (σ/ρ of a resistivity means nothing). ρ here is the density, which the label says.
 */
export function conductivityOverDensityUnit(units: UnitPreferences): string {
  const c = isResistivityUnit(units.conductivity) ? 'MS/m' : units.conductivity;
  return `(${unitLabel(c)})/(${unitLabel(units.density)})`;
}

/** σ/ρ given in SI, (S/m)/(kg/m³), in the chosen units with its unit. */
export function formatConductivityOverDensity(si: number, units: UnitPreferences): string {
  const c = isResistivityUnit(units.conductivity) ? 'MS/m' : units.conductivity;
  const value = fromSiemensPerMetre(si * toKilogramsPerCubicMetre(1, units.density), c);
  return `${formatNumber(value)} ${conductivityOverDensityUnit(units)}`;
}

/** The label of σ/ρ wherever it is shown: ρ is density here, not resistivity. */
export const conductivityOverDensityName = 'σ/ρ (ρ = density)';

/** The quantities of the table, as the API names them. */
export type QuantityCode =
  'conductivity' | 'density' | 'resistivity_temperature_coefficient' | 'relative_permeability';

/** A quantity's name for people; conductivity is called resistivity when read in Ω units. */
export function quantityName(quantity: string, units: UnitPreferences): string {
  switch (quantity) {
    case 'conductivity':
      return conductivityQuantityName(units.conductivity);
    case 'density':
      return 'Density';
    case 'resistivity_temperature_coefficient':
      return 'Temperature coefficient of resistivity';
    case 'relative_permeability':
      return 'Relative permeability';
    default:
      return quantity.replace(/_/g, ' ');
  }
}

/** One SI value of a quantity in the chosen unit, with its unit. */
export function formatQuantityValue(quantity: string, si: number, units: UnitPreferences): string {
  switch (quantity) {
    case 'conductivity':
      return formatConductivity(si, units.conductivity);
    case 'density':
      return formatDensity(si, units.density);
    case 'resistivity_temperature_coefficient':
      return `${formatNumber(si)} /K`;
    default:
      // relative permeability is a ratio: no unit
      return formatNumber(si);
  }
}

/** A range of one quantity in the chosen unit, with its unit; '—' when either end is missing. */
export function formatQuantityRange(
  quantity: string,
  min: number | null | undefined,
  max: number | null | undefined,
  units: UnitPreferences,
): string {
  if (min == null || max == null) return '—';
  switch (quantity) {
    case 'conductivity':
      return formatConductivityRange(min, max, units.conductivity);
    case 'density':
      return formatDensityRange(min, max, units.density);
    case 'resistivity_temperature_coefficient':
      return `${formatNumber(min)}–${formatNumber(max)} /K`;
    default:
      return `${formatNumber(min)}–${formatNumber(max)}`;
  }
}

/** A nominal with its range, as the API stores it (SI). */
export interface ValueSetSI {
  nominal: number;
  min?: number | null;
  max?: number | null;
}

export function isValueSet(v: unknown): v is ValueSetSI {
  return typeof v === 'object' && v !== null && typeof (v as ValueSetSI).nominal === 'number';
}

/** A stored value set in the chosen unit: "28.0 %IACS, range 27.0–29.0 %IACS". */
export function formatValueSet(
  quantity: string,
  v: ValueSetSI,
  units: UnitPreferences,
  rangeNote?: string,
): string {
  const nominal = formatQuantityValue(quantity, v.nominal, units);
  if (rangeNote) return `${nominal} (${rangeNote})`;
  if (v.min == null && v.max == null) return nominal;
  if (v.min == null || v.max == null) {
    const one = v.min ?? v.max!;
    return `${nominal} (${v.min != null ? 'from' : 'to'} ${formatQuantityValue(quantity, one, units)})`;
  }
  return `${nominal} (range ${formatQuantityRange(quantity, v.min, v.max, units)})`;
}

const sameNumber = (a: number | null | undefined, b: number | null | undefined) =>
  (a ?? null) === (b ?? null) ||
  (a != null && b != null && Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)));

/**
 * Before and after of one quantity's value set, in the chosen units: an unchanged range reads
 * "range unchanged" after, not the same figures twice; a range left out of the change is kept.
 */
export function describeValueChange(
  quantity: string,
  before: ValueSetSI | null | undefined,
  after: ValueSetSI,
  units: UnitPreferences,
): { before: string; after: string } {
  const kept = {
    nominal: after.nominal,
    min: after.min === undefined ? before?.min : after.min,
    max: after.max === undefined ? before?.max : after.max,
  };
  const rangeSame =
    before != null && sameNumber(before.min, kept.min) && sameNumber(before.max, kept.max);
  return {
    before: before ? formatValueSet(quantity, before, units) : 'none',
    after: formatValueSet(
      quantity,
      kept,
      units,
      rangeSame && (kept.min != null || kept.max != null) ? 'range unchanged' : undefined,
    ),
  };
}

/** Names of alloy fields other than values, for people. */
export const alloyFieldNames: Record<string, string> = {
  name: 'Name',
  family: 'Family',
  uns: 'UNS number',
  magnetic: 'Magnetic',
  relativePermeability: 'Relative permeability',
  condition: 'Condition',
  notes: 'Notes',
  status: 'Status',
  created: 'Created',
  measurement: 'Measurement',
};

/** A field path as stored in history ("values.conductivity", "notes") in words. */
export function fieldName(field: string, units: UnitPreferences): string {
  if (field.startsWith('values.')) return quantityName(field.slice('values.'.length), units);
  return alloyFieldNames[field] ?? field;
}

/** A plain field's value (name, notes, magnetic…) for reading. */
export function formatPlainValue(v: unknown): string {
  if (v === null || v === undefined || v === '') return 'none';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') return formatNumber(v);
  if (typeof v === 'string') return familyLabels[v] ?? v;
  return JSON.stringify(v);
}

export const familyLabels: Record<string, string> = {
  copper: 'Copper and bronzes',
  'copper-zinc': 'Brasses (copper-zinc)',
  'copper-nickel': 'Copper-nickel and nickel silvers',
  aluminium: 'Aluminium',
  zinc: 'Zinc',
  nickel: 'Nickel',
  'iron-steel': 'Iron and steel',
  precious: 'Precious metals',
  other: 'Other metals',
};

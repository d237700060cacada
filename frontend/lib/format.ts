import { fromSiemensPerMetre } from '../../shared/units/conductivity';
import { unitLabel } from '../../shared/units/codes';
import { fromKilogramsPerCubicMetre } from '../../shared/units/density';

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
 * large or small magnitudes as a × 10ⁿ.
 */
export function formatNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e5 || abs < 1e-3)) {
    const [mantissa, exponent = '0'] = value.toExponential(digits - 1).split('e');
    const power = String(Number(exponent)).replace(/./g, (c) => superscripts[c] ?? c);
    return `${mantissa} × 10${power}`;
  }
  return value.toPrecision(digits);
}

/** A figure for a form field: plain digits a person can edit, no exponent, no trailing zeros. */
export function formatEditable(value: number, digits = 4): string {
  return String(Number(value.toPrecision(digits)));
}

export function formatConductivity(sPerM: number, unit: string): string {
  return `${formatNumber(fromSiemensPerMetre(sPerM, unit))} ${unitLabel(unit)}`;
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

import { percentIacs } from '../units/conductivity';

/** %IACS with three significant figures, the way sorter engineers quote a reading. */
export function formatIacs(sPerM: number): string {
  const p = percentIacs(sPerM);
  return p >= 100 ? p.toFixed(1) : p.toPrecision(3);
}

export function formatIacsRange(minSPerM: number, maxSPerM: number): string {
  return `${formatIacs(minSPerM)}–${formatIacs(maxSPerM)} %IACS`;
}

export function formatCelsius(kelvin: number): string {
  const c = kelvin - 273.15;
  return `${Number.isInteger(Math.round(c * 10) / 10) ? c.toFixed(0) : c.toFixed(1)} °C`;
}

export function formatGPerCm3(kgPerM3: number): string {
  return `${(kgPerM3 / 1000).toFixed(2)} g/cm³`;
}

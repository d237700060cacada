import { useState } from 'react';
import { toFarads, toVolts } from '../../shared/units/circuit';
import { formatNumber } from '../lib/format';

/**
 * Where the words grow stronger. From memory, not re-checked against the text: the US DOE
 * Electrical Safety Handbook (DOE-HDBK-1092, its section on capacitors) treats a bank at 100 V or
 * more storing over about 10 J as able to injure seriously or kill, and far smaller energies as
 * enough for a reflex injury (a jerk against a sharp edge or a moving part).
 */
export const SEVERE_ENERGY_J = 10;
export const SEVERE_VOLTAGE_V = 100;

export interface BankCautionProps {
  /** The bank as entered, SI; unknown while the form holds an invalid figure. */
  capacitanceF?: number;
  voltageV?: number;
  /** A one-line strip that can be opened, for screens where the bank is a side setting. */
  compact?: boolean;
}

/** A bank figure as a form holds it, in SI; undefined while it is not a valid entry. */
export function bankInSi(entry: { value: number | string; unit: string }, kind: 'F' | 'V') {
  try {
    const value = Number(entry.value);
    return kind === 'F' ? toFarads(value, entry.unit) : toVolts(value, entry.unit);
  } catch {
    return undefined;
  }
}

/** ½ C V², or undefined when either figure is missing or not a positive number. */
export function storedEnergyJ(capacitanceF?: number, voltageV?: number): number | undefined {
  if (!(capacitanceF! > 0) || !(voltageV! > 0)) return undefined;
  return 0.5 * capacitanceF! * voltageV! ** 2;
}

/**
 * The bank caution (product.md), naming the energy the bank stores and saying more above the
 * threshold. It can be folded away for this visit, never for good: the folded strip stays on
 * screen, and it opens again by itself whenever the bank crosses the threshold.
 */
export function BankCaution({ capacitanceF, voltageV, compact = false }: BankCautionProps) {
  const energy = storedEnergyJ(capacitanceF, voltageV);
  const severe = energy !== undefined && energy > SEVERE_ENERGY_J && voltageV! >= SEVERE_VOLTAGE_V;
  const [foldedAt, setFoldedAt] = useState<'none' | 'mild' | 'severe'>(compact ? 'mild' : 'none');
  const folded = foldedAt === 'severe' || (foldedAt === 'mild' && !severe);
  const energyText =
    energy === undefined
      ? 'A charged capacitor bank can kill.'
      : `This bank stores ${formatNumber(energy)} J (½ C V² at ${formatNumber(voltageV!)} V).`;

  if (folded) {
    return (
      <div
        role="note"
        aria-label="Caution"
        className="flex flex-wrap items-center justify-between gap-3 rounded-md border-2 border-copper-700 bg-copper-100 px-3 py-1.5 text-sm"
      >
        <span>
          <strong>Caution:</strong> {energyText} A charged bank can kill.
        </span>
        <button type="button" className="underline" onClick={() => setFoldedAt('none')}>
          Show the caution
        </button>
      </div>
    );
  }
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={`rounded-md border-2 p-4 text-sm ${severe ? 'border-red-800 bg-red-50' : 'border-copper-700 bg-copper-100'}`}
    >
      <h2 className="text-base font-semibold">Caution: a charged capacitor bank can kill</h2>
      <p className="mt-1">{energyText}</p>
      {severe ? (
        <p className="mt-2 font-semibold text-red-900">
          Above {SEVERE_ENERGY_J} J at {SEVERE_VOLTAGE_V} V or more, one touch can stop a heart and
          a fault can burst a capacitor or throw the blank like a projectile. Build and run such a
          bank only under a qualified person&apos;s supervision, behind a closed, interlocked
          enclosure, with a permanent bleed resistor and a grounding stick at hand.
        </p>
      ) : null}
      <ul className="mt-2 list-disc pl-5">
        <li>
          Fit bleed resistors across every capacitor, and discharge the bank and check it with a
          meter before touching anything.
        </li>
        <li>Use insulated tools, keep one hand away, and never work on a charged bank alone.</li>
        <li>
          Guard the coil and the blank&apos;s path, wear eye protection, and interlock the enclosure
          so that opening it disarms and discharges the bank.
        </li>
        <li>
          Follow your local electrical codes and licensed practice; these figures are estimates, not
          a design approval.
        </li>
      </ul>
      <button
        type="button"
        className="mt-3 rounded border border-copper-700 px-2 py-0.5"
        onClick={() => setFoldedAt(severe ? 'severe' : 'mild')}
      >
        Fold away for this visit
      </button>
    </aside>
  );
}

import { useState } from 'react';

/**
 * The bank caution (product.md). It can be folded away for this visit, never for good: the
 * folded strip stays on screen and the full text returns on every visit.
 */
export function CautionPanel() {
  const [folded, setFolded] = useState(false);
  if (folded) {
    return (
      <div
        role="note"
        aria-label="Caution"
        className="flex items-center justify-between gap-3 rounded-md border-2 border-copper-700 bg-copper-100 px-3 py-1.5 text-sm"
      >
        <span>
          <strong>Caution:</strong> a charged capacitor bank can kill.
        </span>
        <button type="button" className="underline" onClick={() => setFolded(false)}>
          Show the caution
        </button>
      </div>
    );
  }
  return (
    <aside
      role="note"
      aria-label="Caution"
      className="rounded-md border-2 border-copper-700 bg-copper-100 p-4 text-sm"
    >
      <h2 className="text-base font-semibold">Caution: a charged capacitor bank can kill</h2>
      <ul className="mt-2 list-disc pl-5">
        <li>
          Fit bleed resistors across every capacitor, and discharge the bank and check it with a
          meter before touching anything.
        </li>
        <li>Use insulated tools, keep one hand away, and never work on a charged bank alone.</li>
        <li>
          Guard the coil and the blank's path, and interlock the enclosure so that opening it
          disarms and discharges the bank.
        </li>
        <li>
          Follow your local electrical codes and licensed practice; these figures are estimates, not
          a design approval.
        </li>
      </ul>
      <button
        type="button"
        className="mt-3 rounded border border-copper-700 px-2 py-0.5"
        onClick={() => setFolded(true)}
      >
        Fold away for this visit
      </button>
    </aside>
  );
}

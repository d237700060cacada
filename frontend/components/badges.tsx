/** Small inline marks used wherever an alloy or a value is listed. */
export function FromMemoryBadge() {
  return (
    <span
      className="inline-flex items-center rounded-sm border border-copper-500 px-1.5 text-xs font-medium text-copper-700"
      title="This value rests on a citation that nobody has re-checked against the source yet."
    >
      from memory
    </span>
  );
}

export function MagneticBadge() {
  return (
    <span
      className="inline-flex items-center rounded-sm bg-ink px-1.5 text-xs font-medium text-paper"
      title="Ferromagnetic: an eddy-current reading depends on permeability as well as conductivity."
    >
      magnetic
    </span>
  );
}

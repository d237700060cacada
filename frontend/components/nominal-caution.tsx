/** The caution every figure carries (product.md). */
export function NominalCaution() {
  return (
    <p className="text-xs text-ink/70">
      Handbook values are nominal. Qualify a sorter with certified conductivity reference standards,
      not with this table alone.
    </p>
  );
}

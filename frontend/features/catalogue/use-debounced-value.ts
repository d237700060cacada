import { useEffect, useState } from 'react';

/**
 * The value once it has stopped changing for `delayMs`: the search box follows every keystroke,
 * the table's request only the pause after it (a visitor may make 120 requests a minute).
 */
export function useDebouncedValue<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}

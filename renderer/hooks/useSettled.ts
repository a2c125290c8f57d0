// A value that follows another once it has stayed the same for a moment (a slider at rest, not while it plays).
import { useEffect, useState } from 'react';

/** `value` once it has not changed for `delayMs`; the earlier settled value meanwhile. */
export function useSettled<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const id = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(id);
  }, [value, delayMs]);
  return settled;
}

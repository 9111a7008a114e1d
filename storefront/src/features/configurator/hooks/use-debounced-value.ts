import { useEffect, useState } from 'react';

/** The value as it was `delayMs` after it last changed; `onSettle` runs when the debounce fires. */
export function useDebouncedValue<T>(value: T, delayMs: number, onSettle?: (value: T) => void): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = window.setTimeout(() => {
      onSettle?.(value);
      setSettled(value);
    }, delayMs);
    return () => window.clearTimeout(timer);
    // onSettle is a side channel (a performance mark); a new identity must not restart the wait.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value, delayMs, settled]);
  return settled;
}

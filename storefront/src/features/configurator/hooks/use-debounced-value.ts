import { useEffect, useEffectEvent, useState } from 'react';

/** The value as it was `delayMs` after it last changed; `onSettle` runs when the debounce fires. */
export function useDebouncedValue<T>(value: T, delayMs: number, onSettle?: (value: T) => void): T {
  const [settled, setSettled] = useState(value);
  // onSettle is a side channel (a performance mark): an effect event, so a new identity of it
  // does not restart the wait.
  const settle = useEffectEvent((next: T) => onSettle?.(next));
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = window.setTimeout(() => {
      settle(value);
      setSettled(value);
    }, delayMs);
    return () => window.clearTimeout(timer);
  }, [value, delayMs, settled]);
  return settled;
}

import { startTransition, useEffect, useEffectEvent, useState } from 'react';

/**
 * The value as it was `delayMs` after it last changed; `onSettle` runs when the debounce fires. The
 * settled value is drawn in a transition: what depends on it (the estimate) is not urgent, and the
 * render it starts yields to the browser instead of holding the main thread for the whole page.
 * A change away from `immediateFrom` (there was nothing to wait on, e.g. no board yet) is taken at once.
 */
export function useDebouncedValue<T>(value: T, delayMs: number, onSettle?: (value: T) => void, immediateFrom?: T): T {
  const [settled, setSettled] = useState(value);
  if (immediateFrom !== undefined && Object.is(settled, immediateFrom) && !Object.is(value, immediateFrom)) setSettled(value);
  // onSettle is a side channel (a performance mark): an effect event, so a new identity of it
  // does not restart the wait.
  const settle = useEffectEvent((next: T) => onSettle?.(next));
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = window.setTimeout(() => {
      settle(value);
      startTransition(() => setSettled(value));
    }, delayMs);
    return () => window.clearTimeout(timer);
  }, [value, delayMs, settled]);
  return settled;
}

import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { useDebouncedValue } from './use-debounced-value';

beforeEach(() => vi.useFakeTimers());
afterEach(() => vi.useRealTimers());

describe('useDebouncedValue', () => {
  it('gives the new value once it has been still for the delay, and tells onSettle', () => {
    const onSettle = vi.fn();
    const { result, rerender } = renderHook(({ value }) => useDebouncedValue(value, 250, onSettle), { initialProps: { value: 'a' } });
    rerender({ value: 'ab' });
    act(() => void vi.advanceTimersByTime(200));
    rerender({ value: 'abc' });
    act(() => void vi.advanceTimersByTime(200));
    expect(result.current).toBe('a');
    act(() => void vi.advanceTimersByTime(50));
    expect(result.current).toBe('abc');
    expect(onSettle).toHaveBeenCalledTimes(1);
    expect(onSettle).toHaveBeenCalledWith('abc');
  });

  it('takes a change away from `immediateFrom` at once (there was nothing to wait on)', () => {
    const { result, rerender } = renderHook(({ value }) => useDebouncedValue(value, 250, undefined, ''), { initialProps: { value: '' } });
    rerender({ value: 'board' });
    expect(result.current).toBe('board');
    rerender({ value: 'board, changed' });
    expect(result.current).toBe('board');
  });
});

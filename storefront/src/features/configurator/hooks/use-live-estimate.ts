import { useMemo, useRef } from 'react';
import { decodeConfiguration, type EstimateView, type RigConfiguration } from '@loomwright/shared';
import { useEstimate } from '../api/create-estimate';
import { missingChoices } from '../lib/configuration';
import { useDebouncedValue } from './use-debounced-value';

/** Marks for the latency benchmark: debounce fired → figures on screen. */
export const ESTIMATE_REQUESTED_MARK = 'lw:estimate-requested';
export const ESTIMATE_SHOWN_MARK = 'lw:estimate-shown';
export const ESTIMATE_LATENCY_MEASURE = 'lw:estimate-latency';

const DEBOUNCE_MS = 250;

/**
 * Asks POST /api/estimates for the configuration once it has been still for a moment, so typing a
 * pedal name sends one request, not twenty. The previous figures stay until the next arrive.
 * Nothing is asked until the player has chosen a surface, a case and their pedals: `missing`
 * says what is still to choose, and no figures are shown for choices they did not make.
 */
export function useLiveEstimate(encoded: string, view: EstimateView = 'panel') {
  // The first board (the configurator had none while the price book was on its way: '') is asked for at once.
  const settled = useDebouncedValue(
    encoded,
    DEBOUNCE_MS,
    () => {
      performance.clearMarks(ESTIMATE_REQUESTED_MARK);
      performance.mark(ESTIMATE_REQUESTED_MARK);
    },
    '',
  );
  const configuration = useMemo(() => decodeConfiguration(settled) as RigConfiguration | undefined, [settled]);
  const ready = configuration !== undefined && missingChoices(configuration).length === 0;
  const query = useEstimate(settled, ready ? configuration : undefined, view);
  const missing = useMemo(() => missingChoices(decodeConfiguration(encoded) as RigConfiguration | undefined), [encoded]);
  // A refused or failed request must not blank the figures the player was reading; a choice
  // taken back (Start over) does.
  const lastGood = useRef(query.data);
  if (!ready) lastGood.current = undefined;
  else if (query.data) lastGood.current = query.data;
  return {
    /** What the player has still to choose before there is anything to price. */
    missing,
    estimate: ready ? (query.data ?? lastGood.current) : undefined,
    /** The figures shown answer the configuration as it is now. */
    isCurrent: ready && query.data !== undefined && !query.isPlaceholderData && settled === encoded,
    /** The figures on screen belong to an earlier configuration than the one being edited. */
    isUpdating: missing.length === 0 && (settled !== encoded || query.isFetching),
    error: ready ? query.error : null,
    settled,
  };
}

export type LiveEstimate = ReturnType<typeof useLiveEstimate>;

/** Called once new figures are committed to the screen. */
export function markEstimateShown(): void {
  if (performance.getEntriesByName(ESTIMATE_REQUESTED_MARK, 'mark').length === 0) return;
  performance.mark(ESTIMATE_SHOWN_MARK);
  performance.measure(ESTIMATE_LATENCY_MEASURE, ESTIMATE_REQUESTED_MARK, ESTIMATE_SHOWN_MARK);
  performance.clearMarks(ESTIMATE_REQUESTED_MARK);
}

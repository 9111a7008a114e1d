import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useLocation, useNavigationType } from 'react-router';
import { useSearchParamsInOrder } from '@loomwright/shared/ui';
import { CONFIGURATION_PARAM, decodeConfiguration, encodeConfiguration, type Catalog, type RigConfiguration } from '@loomwright/shared';
import { clearConfigurationDraft, readConfigurationDraft, writeConfigurationDraft } from 'src/lib/configuration-draft';
import { completeConfiguration } from '../lib/configuration';
import { isStepId, type StepId } from '../lib/steps';

export type ConfigurationUpdate = (current: RigConfiguration) => RigConfiguration;

/** Marks the address changes the configurator makes itself, so they are never read back as a new link. */
const OWN_CHANGE = { configurator: true } as const;
const isOwnChange = (state: unknown) => typeof state === 'object' && state !== null && 'configurator' in state;

/**
 * The configuration is held in React state, so every change lands at once and builds on the one
 * before it; the URL (`?c=`, the shared codec) mirrors it, so a reload or a shared link restores
 * it, and a local draft keeps it for a closed tab. The step lives in the URL: step changes push a
 * history entry, so the browser's Back walks the steps and keeps what was entered.
 */
export function useConfiguration(catalog: Catalog | undefined) {
  const [searchParams, setSearchParams] = useSearchParamsInOrder();
  const location = useLocation();
  const navigationType = useNavigationType();
  const encodedInUrl = searchParams.get(CONFIGURATION_PARAM);

  // First visit: the link's configuration, else the draft this browser kept, else the defaults. Worked
  // out once the price book is in (the configurator shows its frame until then, in the same places).
  const open = (book: Catalog) => {
    if (encodedInUrl) return { configuration: completeConfiguration(decodeConfiguration(encodedInUrl), book), savedAt: null };
    const draft = readConfigurationDraft();
    return { configuration: completeConfiguration(draft?.configuration, book), savedAt: draft?.savedAt ?? null };
  };
  const [start] = useState(() => (catalog ? open(catalog) : undefined));
  const [configuration, setConfiguration] = useState<RigConfiguration | undefined>(start?.configuration);
  const [restoredFrom, setRestoredFrom] = useState<string | null>(start?.savedAt ?? null);
  const latest = useRef(configuration);
  if (catalog && !configuration) {
    // The price book has just arrived: this render starts over with the board opened (React's
    // "adjusting state while rendering"; nothing of this pass is committed).
    const opened = open(catalog);
    latest.current = opened.configuration;
    setConfiguration(opened.configuration);
    setRestoredFrom(opened.savedAt);
  }
  const encoded = useMemo(() => (configuration ? encodeConfiguration(configuration) : undefined), [configuration]);
  const untouched = useMemo(() => (catalog ? encodeConfiguration(completeConfiguration(undefined, catalog)) : undefined), [catalog]);

  const update = useCallback((change: ConfigurationUpdate) => {
    if (!latest.current) return;
    latest.current = change(latest.current);
    setConfiguration(latest.current);
  }, []);

  // Keep the URL in step with the state. A configuration arriving by a link followed on this page
  // replaces the one on screen; our own changes and the browser's Back and Forward do not.
  const seenEntry = useRef(location.key);
  useEffect(() => {
    const newEntry = seenEntry.current !== location.key;
    seenEntry.current = location.key;
    if (!encoded || !catalog || encodedInUrl === encoded) return;
    // A fresh board (no `?c=`, nothing entered yet) reads the same from a bare /configure: the address
    // is left as it is, sparing the first screen a navigation and the whole page's redraw.
    if (!encodedInUrl && encoded === untouched) return;
    if (newEntry && encodedInUrl && navigationType !== 'POP' && !isOwnChange(location.state)) {
      update(() => completeConfiguration(decodeConfiguration(encodedInUrl), catalog));
      setRestoredFrom(null);
      return;
    }
    setSearchParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (latest.current) next.set(CONFIGURATION_PARAM, encodeConfiguration(latest.current));
        return next;
      },
      { replace: true, state: OWN_CHANGE },
    );
  }, [encoded, encodedInUrl, untouched, location.key, location.state, navigationType, catalog, update, setSearchParams]);

  // An untouched default (a fresh visit, or Start over) is not worth restoring later; anything
  // the player changed is.
  useEffect(() => {
    if (!configuration) return;
    if (encoded === untouched) clearConfigurationDraft();
    else writeConfigurationDraft(configuration);
  }, [encoded, untouched, configuration]);

  const stepParam = searchParams.get('step');
  const step: StepId = isStepId(stepParam) ? stepParam : 'surface';
  const goToStep = useCallback(
    (target: StepId) =>
      setSearchParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          next.set('step', target);
          // Before the price book is in (the frame's step bar) only the step changes.
          if (latest.current) next.set(CONFIGURATION_PARAM, encodeConfiguration(latest.current));
          return next;
        },
        { state: OWN_CHANGE },
      ),
    [setSearchParams],
  );

  const startOver = useCallback(() => {
    if (!catalog) return;
    setRestoredFrom(null);
    update(() => completeConfiguration(undefined, catalog));
    goToStep('surface');
  }, [update, goToStep, catalog]);

  return { configuration, encoded, update, step, goToStep, restoredFrom, startOver, dismissRestored: () => setRestoredFrom(null) };
}

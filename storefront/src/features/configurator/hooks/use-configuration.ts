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
export function useConfiguration(catalog: Catalog) {
  const [searchParams, setSearchParams] = useSearchParamsInOrder();
  const location = useLocation();
  const navigationType = useNavigationType();
  const encodedInUrl = searchParams.get(CONFIGURATION_PARAM);

  // First visit: the link's configuration, else the draft this browser kept, else the defaults.
  const [start] = useState(() => {
    if (encodedInUrl) return { configuration: completeConfiguration(decodeConfiguration(encodedInUrl), catalog), savedAt: null };
    const draft = readConfigurationDraft();
    return { configuration: completeConfiguration(draft?.configuration, catalog), savedAt: draft?.savedAt ?? null };
  });
  const [configuration, setConfiguration] = useState(start.configuration);
  const [restoredFrom, setRestoredFrom] = useState<string | null>(start.savedAt);
  const latest = useRef(configuration);
  const encoded = useMemo(() => encodeConfiguration(configuration), [configuration]);
  const untouched = useMemo(() => encodeConfiguration(completeConfiguration(undefined, catalog)), [catalog]);

  const update = useCallback((change: ConfigurationUpdate) => {
    latest.current = change(latest.current);
    setConfiguration(latest.current);
  }, []);

  // Keep the URL in step with the state. A configuration arriving by a link followed on this page
  // replaces the one on screen; our own changes and the browser's Back and Forward do not.
  const seenEntry = useRef(location.key);
  useEffect(() => {
    const newEntry = seenEntry.current !== location.key;
    seenEntry.current = location.key;
    if (encodedInUrl === encoded) return;
    if (newEntry && encodedInUrl && navigationType !== 'POP' && !isOwnChange(location.state)) {
      update(() => completeConfiguration(decodeConfiguration(encodedInUrl), catalog));
      setRestoredFrom(null);
      return;
    }
    setSearchParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set(CONFIGURATION_PARAM, encodeConfiguration(latest.current));
        return next;
      },
      { replace: true, state: OWN_CHANGE },
    );
  }, [encoded, encodedInUrl, location.key, location.state, navigationType, catalog, update, setSearchParams]);

  // An untouched default (a fresh visit, or Start over) is not worth restoring later; anything
  // the player changed is.
  useEffect(() => {
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
          next.set(CONFIGURATION_PARAM, encodeConfiguration(latest.current));
          return next;
        },
        { state: OWN_CHANGE },
      ),
    [setSearchParams],
  );

  const startOver = useCallback(() => {
    setRestoredFrom(null);
    update(() => completeConfiguration(undefined, catalog));
    goToStep('surface');
  }, [update, goToStep, catalog]);

  return { configuration, encoded, update, step, goToStep, restoredFrom, startOver, dismissRestored: () => setRestoredFrom(null) };
}

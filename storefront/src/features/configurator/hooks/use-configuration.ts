import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useSearchParams } from 'react-router';
import {
  CONFIGURATION_PARAM,
  decodeConfiguration,
  encodeConfiguration,
  type Catalog,
  type RigConfiguration,
} from '@loomwright/shared';
import { readConfigurationDraft, writeConfigurationDraft } from 'src/lib/configuration-draft';
import { completeConfiguration } from '../lib/configuration';
import { isStepId, type StepId } from '../lib/steps';

export type ConfigurationUpdate = (current: RigConfiguration) => RigConfiguration;

/**
 * The configuration lives in the URL (`?c=`, the shared codec), so a reload or a shared link
 * restores it; every change is also kept as a local draft for a closed tab. Step changes push a
 * history entry (the browser's Back walks the steps); edits replace the current entry.
 */
export function useConfiguration(catalog: Catalog) {
  const [searchParams, setSearchParams] = useSearchParams();
  const encodedInUrl = searchParams.get(CONFIGURATION_PARAM);
  const [restoredFrom, setRestoredFrom] = useState<string | null>(null);

  // A visit without `c` picks up the draft this browser kept, once.
  const restoredOnce = useRef(false);
  useEffect(() => {
    if (restoredOnce.current || encodedInUrl) return;
    restoredOnce.current = true;
    const draft = readConfigurationDraft();
    if (!draft) return;
    setRestoredFrom(draft.savedAt);
    setSearchParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set(CONFIGURATION_PARAM, encodeConfiguration(completeConfiguration(draft.configuration, catalog)));
        return next;
      },
      { replace: true },
    );
  }, [encodedInUrl, catalog, setSearchParams]);

  const configuration = useMemo(
    () => completeConfiguration(decodeConfiguration(encodedInUrl), catalog),
    [encodedInUrl, catalog],
  );
  const encoded = useMemo(() => encodeConfiguration(configuration), [configuration]);

  useEffect(() => {
    if (encodedInUrl) writeConfigurationDraft(configuration);
  }, [encodedInUrl, configuration]);

  const update = useCallback(
    (change: ConfigurationUpdate) =>
      setSearchParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          const current = completeConfiguration(decodeConfiguration(prev.get(CONFIGURATION_PARAM)), catalog);
          next.set(CONFIGURATION_PARAM, encodeConfiguration(change(current)));
          return next;
        },
        { replace: true },
      ),
    [setSearchParams, catalog],
  );

  const stepParam = searchParams.get('step');
  const step: StepId = isStepId(stepParam) ? stepParam : 'surface';
  const goToStep = useCallback(
    (target: StepId) =>
      setSearchParams((prev) => {
        const next = new URLSearchParams(prev);
        next.set('step', target);
        if (!next.get(CONFIGURATION_PARAM)) next.set(CONFIGURATION_PARAM, encoded);
        return next;
      }),
    [setSearchParams, encoded],
  );

  const startOver = useCallback(() => {
    setRestoredFrom(null);
    setSearchParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set(CONFIGURATION_PARAM, encodeConfiguration(completeConfiguration(undefined, catalog)));
        next.set('step', 'surface');
        return next;
      },
    );
  }, [setSearchParams, catalog]);

  return { configuration, encoded, update, step, goToStep, restoredFrom, startOver, dismissRestored: () => setRestoredFrom(null) };
}

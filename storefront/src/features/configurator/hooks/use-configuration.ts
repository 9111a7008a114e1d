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
  const [searchParams, setRouterSearchParams] = useSearchParams();
  // React Router hands every functional update the params of the last render, so two changes in
  // quick succession (a loop ticked, then Next) would each start from the same old URL and the
  // later one would undo the earlier. Each change here starts from the one before it instead.
  const latest = useRef(searchParams);
  const lastRendered = useRef(searchParams.toString());
  const sent = useRef<string[]>([]);
  const rendered = searchParams.toString();
  if (rendered !== lastRendered.current) {
    lastRendered.current = rendered;
    const at = sent.current.indexOf(rendered);
    if (at >= 0) {
      // One of ours catching up; anything sent after it is still on its way.
      sent.current = sent.current.slice(at + 1);
    } else {
      // Not one of ours: the player moved through history or followed a link.
      latest.current = searchParams;
      sent.current = [];
    }
  }
  const setSearchParams = useCallback(
    (change: (prev: URLSearchParams) => URLSearchParams, options?: { replace?: boolean }) => {
      const next = change(new URLSearchParams(latest.current));
      latest.current = next;
      sent.current.push(next.toString());
      setRouterSearchParams(next, options);
    },
    [setRouterSearchParams],
  );
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

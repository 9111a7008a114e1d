import { useCallback, useRef } from 'react';
import { useSearchParams, type NavigateOptions } from 'react-router';

/**
 * React Router's `useSearchParams`, with changes that build on each other. The router hands a
 * functional update the params of the last render and the navigation lands a moment later, so two
 * changes in that moment (a row opened as a debounced search fires; a step pushed as a mirrored
 * edit replaces) would each start from the same old params and the later would undo the earlier.
 * Here each change starts from the one before it. A render of params we did not send (the
 * browser's Back, a link) becomes the new starting point; our own arriving late do not.
 */
export function useSearchParamsInOrder() {
  const [search, setRouterSearch] = useSearchParams();
  const latest = useRef(search);
  const lastRendered = useRef(search.toString());
  const sent = useRef<string[]>([]);
  const rendered = search.toString();
  if (rendered !== lastRendered.current) {
    lastRendered.current = rendered;
    const at = sent.current.indexOf(rendered);
    if (at >= 0) {
      // One of ours catching up; anything sent after it is still on its way.
      sent.current = sent.current.slice(at + 1);
    } else {
      latest.current = search;
      sent.current = [];
    }
  }

  const setSearch = useCallback(
    (change: (latest: URLSearchParams) => URLSearchParams, options?: NavigateOptions) => {
      const next = change(new URLSearchParams(latest.current));
      latest.current = next;
      sent.current.push(next.toString());
      setRouterSearch(next, options);
    },
    [setRouterSearch],
  );

  return [search, setSearch] as const;
}

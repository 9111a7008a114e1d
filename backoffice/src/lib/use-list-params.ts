import { useCallback, useMemo, useRef } from 'react';
import { useSearchParams } from 'react-router';

export type SortOrder = 'asc' | 'desc';

export interface ListParams<F extends string> {
  page: number;
  pageSize: number;
  sort: string;
  order: SortOrder;
  filters: Record<F, string>;
}

export interface ListParamsDefaults<F extends string> {
  sort: string;
  order: SortOrder;
  pageSize?: number;
  filters: Record<F, string>;
}

export const pageSizes = [25, 50, 100] as const;

/**
 * A server-side list's page, sort and filters, kept in the address bar so a filtered view can be
 * bookmarked, shared, and survives a reload. Changing a filter or the sort goes back to page 1,
 * because the old page number means nothing in a different list.
 */
export function useListParams<F extends string>(defaults: ListParamsDefaults<F>) {
  const [search, setSearch] = useSearchParams();
  // The router's functional update hands over the params of the render that made the setter, and
  // the navigation lands a moment later. Two changes in that moment (a row opened just as the
  // debounced search fires) would each start from the same old params and the later would undo
  // the earlier. So each change starts from the one before it; a render from somewhere else (the
  // browser's Back, a link) becomes the new starting point.
  const latest = useRef(search);
  const lastRendered = useRef(search.toString());
  const sent = useRef<string[]>([]);
  const rendered = search.toString();
  if (rendered !== lastRendered.current) {
    lastRendered.current = rendered;
    const at = sent.current.indexOf(rendered);
    if (at >= 0) sent.current = sent.current.slice(at + 1); // one of ours; later ones still on their way
    else {
      latest.current = search;
      sent.current = [];
    }
  }

  const params = useMemo<ListParams<F>>(() => {
    const pageSize = Number(search.get('pageSize'));
    const filters = { ...defaults.filters };
    for (const key of Object.keys(defaults.filters) as F[]) {
      const value = search.get(key);
      if (value !== null) filters[key] = value;
    }
    const order = search.get('order');
    return {
      page: Math.max(1, Number(search.get('page')) || 1),
      pageSize: (pageSizes as readonly number[]).includes(pageSize) ? pageSize : (defaults.pageSize ?? 25),
      sort: search.get('sort') ?? defaults.sort,
      order: order === 'asc' || order === 'desc' ? order : defaults.order,
      filters,
    };
    // defaults are a literal at the call site; the address bar is the source of truth.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [search]);

  const update = useCallback(
    (patch: Partial<Omit<ListParams<F>, 'filters'>> & { filters?: Partial<Record<F, string>> }) => {
      setSearch(
        () => {
          const next = new URLSearchParams(latest.current);
          const resetsPage = patch.filters !== undefined || patch.sort !== undefined || patch.pageSize !== undefined;
          for (const [key, value] of Object.entries(patch.filters ?? {}) as [string, string | undefined][]) {
            if (value === undefined || value === '' || value === (defaults.filters as Record<string, string>)[key]) next.delete(key);
            else next.set(key, value);
          }
          if (patch.sort !== undefined) next.set('sort', patch.sort);
          if (patch.order !== undefined) next.set('order', patch.order);
          if (patch.pageSize !== undefined) next.set('pageSize', String(patch.pageSize));
          if (patch.page !== undefined) next.set('page', String(patch.page));
          else if (resetsPage) next.delete('page');
          latest.current = next;
          sent.current.push(next.toString());
          return next;
        },
        { replace: true },
      );
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [setSearch],
  );

  /** Click on a column header: a new column sorts its natural way, the same column flips. */
  const toggleSort = useCallback(
    (sortKey: string, firstOrder: SortOrder = 'asc') => {
      if (params.sort === sortKey) update({ sort: sortKey, order: params.order === 'asc' ? 'desc' : 'asc' });
      else update({ sort: sortKey, order: firstOrder });
    },
    [params.sort, params.order, update],
  );

  return { params, update, toggleSort };
}

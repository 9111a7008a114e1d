import { useSearchParamsInOrder } from '@loomwright/shared/ui';
import { useCallback, useMemo, useState } from 'react';

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

/** The page and sort of a list query, read from the address bar's params (`S`: the list's sort keys). */
export function pageQuery<S extends string>(params: ListParams<string>) {
  return { page: params.page, pageSize: params.pageSize, sort: params.sort as S, order: params.order };
}

/**
 * A server-side list's page, sort and filters, kept in the address bar so a filtered view can be
 * bookmarked, shared, and survives a reload. Changing a filter or the sort goes back to page 1,
 * because the old page number means nothing in a different list.
 */
export function useListParams<F extends string>(defaultsAtMount: ListParamsDefaults<F>) {
  // The defaults are a literal at the call site (a new object each render): the first one is kept,
  // and the address bar is the source of truth from then on.
  const [defaults] = useState(defaultsAtMount);
  const [search, setSearch] = useSearchParamsInOrder();

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
  }, [search, defaults]);

  const update = useCallback(
    (patch: Partial<Omit<ListParams<F>, 'filters'>> & { filters?: Partial<Record<F, string>> }) => {
      setSearch(
        (latest) => {
          const next = new URLSearchParams(latest);
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
          return next;
        },
        { replace: true },
      );
    },
    [setSearch, defaults],
  );

  /** Click on a column header: a new column sorts its natural way, the same column flips. */
  const toggleSort = useCallback(
    (sortKey: string, firstOrder: SortOrder = 'asc') => {
      if (params.sort === sortKey) update({ sort: sortKey, order: params.order === 'asc' ? 'desc' : 'asc' });
      else update({ sort: sortKey, order: firstOrder });
    },
    [params.sort, params.order, update],
  );

  /** What a DataTable needs to page and sort through these params. */
  const paging = useMemo(
    () => ({
      page: params.page,
      pageSize: params.pageSize,
      sort: params.sort,
      order: params.order,
      onSort: toggleSort,
      onPage: (page: number) => update({ page }),
      onPageSize: (pageSize: number) => update({ pageSize }),
    }),
    [params.page, params.pageSize, params.sort, params.order, toggleSort, update],
  );

  /** One filter's value and its setter, to spread on a SearchField or a SelectFilter: `<SearchField {...filter('q')} />`. */
  const filter = useCallback(
    (key: F) => ({
      value: params.filters[key],
      onChange: (value: string) => update({ filters: { [key]: value } as Partial<Record<F, string>> }),
    }),
    [params.filters, update],
  );

  return { params, update, toggleSort, paging, filter };
}

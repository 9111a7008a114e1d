// Offset paging of a long list, read from whichever end of the list is nearer.

/** The (sort, id) order of a list page, or its reverse (for a page nearer the end than the start). */
export function flip(order: 'asc' | 'desc', reverse: boolean): 'asc' | 'desc' {
  if (!reverse) return order;
  return order === 'asc' ? 'desc' : 'asc';
}

/**
 * Where a page starts when it is read from the far end of the list: a page past the middle is the
 * same rows as a short page counted back from the end in the reverse order, so the index skips
 * `total - offset - limit` entries instead of `offset` (the last page of 100,000 rows skips none).
 * Null when the page is nearer the start. PostgreSQL's reverse of `asc` (nulls last) is `desc`
 * (nulls first), so a nullable sort column reverses exactly too.
 */
export function fromTheEnd(total: number, offset: number, limit: number): { offset: number; limit: number } | null {
  if (offset <= total / 2 || offset >= total) return null;
  const back = total - offset - limit;
  return back >= 0 ? { offset: back, limit } : { offset: 0, limit: limit + back };
}

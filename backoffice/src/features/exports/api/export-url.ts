import type { DateRangeQuery, ExportKind } from '@loomwright/shared';

/**
 * The address of one CSV export. A plain link (the session cookie rides along), so the browser
 * saves the file as the server streams it, however long it is.
 */
export const exportUrl = (kind: ExportKind, range: DateRangeQuery) =>
  `/api/exports/${kind}.csv?${new URLSearchParams({ from: range.from, to: range.to }).toString()}`;

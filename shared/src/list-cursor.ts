/**
 * Keyset paging's cursor as it travels in a query string: base64url (RFC 4648, section 5) of a small
 * JSON array, so a link or a script can carry it as it is. Each list decides what the array holds and
 * checks every part on the way back in.
 */
export const encodeCursorParts = (parts: unknown[]): string =>
  btoa(JSON.stringify(parts)).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');

/** The array a cursor carries, or null when the text is not base64url of a JSON array. */
export function decodeCursorParts(value: string): unknown[] | null {
  try {
    const parsed: unknown = JSON.parse(atob(value.replace(/-/g, '+').replace(/_/g, '/')));
    return Array.isArray(parsed) ? parsed : null;
  } catch {
    return null;
  }
}

/** A `timestamptz` as PostgreSQL writes it in text (ISO 8601 with a space, microseconds when there are any). */
export const timestampKeyShape = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?$/;
export const uuidShape = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

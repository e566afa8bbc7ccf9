/**
 * Ids of stored rows (PostgreSQL UUIDs), the one pattern every page, route and reader checks.
 * Anything that is not an id cannot name a stored row, so at the HTTP edge it is a 404, not a
 * server error.
 */
import { notFound } from '@/src/server/errors';

export const ID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isId(s: string): boolean {
  return ID_PATTERN.test(s);
}

/** The id, or a 404 naming what has no such address. */
export function requireId(id: string, what: string): string {
  if (!isId(id)) throw notFound(`No ${what} has this address.`);
  return id;
}

/** Ids in URLs: anything that is not a UUID cannot name a stored row, so it is a 404, not a server error. */
import { notFound } from '@/src/server/errors';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function requireId(id: string, what: string): string {
  if (!UUID.test(id)) throw notFound(`No ${what} has this address.`);
  return id;
}

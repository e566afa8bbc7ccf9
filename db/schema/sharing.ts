/**
 * Read-only links to one run, for people outside the network. The link's token
 * is not stored: it is signed (HMAC) over the link id and its expiry, and
 * checked against this row, which says whether it was revoked.
 */
import { index, pgTable } from 'drizzle-orm/pg-core';
import { networks } from './networks';
import { runs } from './runs';
import { at, byUser, createdAt, parent, uuidId } from './columns';

export const runLinks = pgTable(
  'run_links',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    runId: parent('run_id', () => runs.id),
    createdBy: byUser('created_by'),
    createdAt: createdAt(),
    expiresAt: at('expires_at').notNull(),
    revokedAt: at('revoked_at'),
    revokedBy: byUser('revoked_by'),
  },
  (t) => [index('run_links_run_idx').on(t.runId)],
);

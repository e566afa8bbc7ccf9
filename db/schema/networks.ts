/**
 * Networks (team spaces), their memberships with a role, and invitations.
 */
import { index, pgEnum, pgTable, primaryKey, text } from 'drizzle-orm/pg-core';
import { users } from './auth';
import { at, byUser, createdAt, parent, uuidId } from './columns';

export const networkRole = pgEnum('network_role', ['owner', 'analyst', 'viewer']);

export const networks = pgTable('networks', {
  id: uuidId(),
  name: text('name').notNull(),
  createdBy: byUser('created_by'),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  'memberships',
  {
    networkId: parent('network_id', () => networks.id),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: networkRole('role').notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.networkId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

/** Only the SHA-256 of the invitation token is stored; the token travels in the e-mail. */
export const invitations = pgTable(
  'invitations',
  {
    id: uuidId(),
    networkId: parent('network_id', () => networks.id),
    email: text('email').notNull(),
    role: networkRole('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: byUser('invited_by'),
    expiresAt: at('expires_at').notNull(),
    acceptedAt: at('accepted_at'),
    acceptedBy: byUser('accepted_by'),
    revokedAt: at('revoked_at'),
    createdAt: createdAt(),
  },
  (t) => [index('invitations_network_idx').on(t.networkId)],
);

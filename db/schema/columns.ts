/**
 * Column builders the tables share, so each common column (random id, creation
 * time, owning parent, acting user) is declared once.
 */
import { text, timestamp, uuid, type AnyPgColumn } from 'drizzle-orm/pg-core';
import { users } from './auth';

/** Random uuid primary key. */
export const uuidId = () => uuid('id').primaryKey().defaultRandom();

/** An instant, stored with its time zone. */
export const at = (name: string) => timestamp(name, { withTimezone: true });

/** When the row was written. */
export const createdAt = () => at('created_at').notNull().defaultNow();

/** The row this one belongs to; by default it goes when that row goes. */
export const parent = (name: string, column: () => AnyPgColumn, onDelete: 'cascade' | 'restrict' = 'cascade') =>
  uuid(name).notNull().references(column, { onDelete });

/** The user who did something; null once that account is removed. */
export const byUser = (name: string) => text(name).references(() => users.id, { onDelete: 'set null' });

import { sql } from 'drizzle-orm';
import { boolean, check, index, integer, json, jsonb, pgTable, serial, text, timestamp, varchar } from 'drizzle-orm/pg-core';

export const users = pgTable('users', {
  id: serial('id').primaryKey(),
  username: varchar('username', { length: 40 }).notNull().unique(),
  displayName: varchar('display_name', { length: 80 }).notNull(),
  email: varchar('email', { length: 200 }),
  role: varchar('role', { length: 16, enum: ['engineer', 'reviewer', 'winder', 'admin'] }).notNull(),
  passwordHash: text('password_hash').notNull(),
  theme: varchar('theme', { length: 8, enum: ['light', 'dark'] }),
  disabled: boolean('disabled').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
}, (t) => [
  check('users_role_check', sql`${t.role} in ('engineer', 'reviewer', 'winder', 'admin')`),
  check('users_theme_check', sql`${t.theme} is null or ${t.theme} in ('light', 'dark')`),
]);

export const auditLog = pgTable(
  'audit_log',
  {
    id: serial('id').primaryKey(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
    actorName: varchar('actor_name', { length: 80 }),
    action: varchar('action', { length: 60 }).notNull(),
    target: varchar('target', { length: 200 }),
    details: jsonb('details'),
    ip: varchar('ip', { length: 64 }),
  },
  (t) => [index('audit_log_at_idx').on(t.at)],
);

// Table layout required by connect-pg-simple (its table.sql), created by a migration rather than at run time.
export const session = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
);

export const appSettings = pgTable('app_settings', {
  key: varchar('key', { length: 60 }).primaryKey(),
  value: jsonb('value').notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().default(sql`now()`),
});

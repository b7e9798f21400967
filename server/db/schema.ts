import { sql } from 'drizzle-orm';
import {
  bigserial,
  check,
  customType,
  index,
  integer,
  json,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  serial,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
  varchar,
} from 'drizzle-orm/pg-core';

// Tables are added here and turned into SQL migrations with `npm run db:generate`.

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  'users',
  {
    id: serial('id').primaryKey(),
    provider: text('provider').notNull().default('github'),
    providerId: text('provider_id').notNull(),
    login: text('login').notNull(),
    name: text('name'),
    email: text('email'),
    avatarUrl: text('avatar_url'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('users_provider_id_idx').on(t.provider, t.providerId)],
);

/** Roles on a project, weakest first (see server/authz/roles.ts). */
export const projectRole = pgEnum('project_role', ['viewer', 'editor', 'owner']);

export const projects = pgTable('projects', {
  id: uuid('id').primaryKey().defaultRandom(),
  title: text('title').notNull(),
  /** The sheet file (shared/contracts/sheet-format.md) at `version`: the snapshot the op log builds on. */
  sheet: jsonb('sheet').notNull(),
  /** Bumped on every change of the sheet; clients send it back as `baseVersion`. */
  version: integer('version').notNull().default(1),
  /** Read-only share link token; null while sharing is off. */
  shareToken: text('share_token').unique(),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  updatedBy: integer('updated_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    role: projectRole('role').notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: projectRole('role').notNull(),
    /** SHA-256 of the token in the accept link; the token itself is only ever in the e-mail. */
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: integer('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: integer('accepted_by').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('invitations_project_idx').on(t.projectId)],
);

/** `named`: saved by a person; `restore`: a restore, recorded; `auto`: the state just before a restore. */
export const revisionKind = pgEnum('revision_kind', ['named', 'restore', 'auto']);

export const revisions = pgTable(
  'revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    label: text('label').notNull(),
    kind: revisionKind('kind').notNull().default('named'),
    sheet: jsonb('sheet').notNull(),
    /** The project's version whose sheet this revision holds. */
    projectVersion: integer('project_version').notNull(),
    restoredFrom: uuid('restored_from'),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('revisions_project_idx').on(t.projectId, t.createdAt)],
);

/**
 * The co-editing operation log: one row per accepted batch of operations. `version` is the project
 * version the batch produced; `projects.sheet` at `projects.version` is the snapshot, so a client at
 * version v catches up with the rows of version > v.
 */
export const sheetOps = pgTable(
  'sheet_ops',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    projectId: uuid('project_id').notNull().references(() => projects.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
    ops: jsonb('ops').notNull(),
    /** The client's id for a live batch (shared/sync/protocol.ts): a batch re-sent after a reconnect is committed once. Null for REST changes. */
    batchId: text('batch_id'),
    createdAt: createdAt(),
  },
  (t) => [
    unique('sheet_ops_project_version_key').on(t.projectId, t.version),
    check('sheet_ops_version_positive', sql`${t.version} > 0`),
    uniqueIndex('sheet_ops_project_batch_idx').on(t.projectId, t.batchId),
  ],
);

const bytea = customType<{ data: Buffer }>({ dataType: () => 'bytea' });

/** Needed by @socket.io/postgres-adapter for large or binary events; it never creates it itself. */
export const socketIoAttachments = pgTable('socket_io_attachments', {
  id: bigserial('id', { mode: 'number' }).unique(),
  createdAt: timestamp('created_at', { withTimezone: true }).defaultNow(),
  payload: bytea('payload'),
});

/** connect-pg-simple's table, with the names it hard-codes (session_pkey, IDX_session_expire). */
export const session = pgTable(
  'session',
  {
    sid: varchar('sid').primaryKey(),
    sess: json('sess').notNull(),
    expire: timestamp('expire', { precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
);

/** What the development SMTP sink received (only used when no SMTP_HOST is configured). */
export const devMail = pgTable('dev_mail', {
  id: serial('id').primaryKey(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
  mailFrom: text('mail_from').notNull(),
  rcptTo: text('rcpt_to').array().notNull(),
  subject: text('subject').notNull().default(''),
  text: text('text').notNull().default(''),
  html: text('html'),
});

export type User = typeof users.$inferSelect;
export type Project = typeof projects.$inferSelect;
export type ProjectRole = (typeof projectRole.enumValues)[number];
export type Revision = typeof revisions.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;

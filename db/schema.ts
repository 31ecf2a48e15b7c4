// Drizzle schema for Fluxfolio: people and manuscripts (foundation), figure notes, figures, runs,
// cached results and frozen snapshots (figure notes step).
import { relations } from 'drizzle-orm';
import {
  boolean,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import type { FigureKind, FigureParams } from '@/lib/figure-kinds/registry';
import type { TaskSpec } from '@/lib/physics/schemas';

// ---------------------------------------------------------------------------------------------
// Enums
// ---------------------------------------------------------------------------------------------

export const manuscriptStatus = pgEnum('manuscript_status', ['draft', 'submitted', 'published']);
/** Ordered from most to least rights: each role includes the rights of the next. */
export const memberRole = pgEnum('member_role', ['owner', 'author', 'coauthor']);
export const runStatus = pgEnum('run_status', ['queued', 'running', 'succeeded', 'failed', 'cancelled']);

// ---------------------------------------------------------------------------------------------
// People and sign-in (column property names follow @auth/drizzle-adapter; SQL names are snake_case)
// ---------------------------------------------------------------------------------------------

export const users = pgTable('users', {
  id: text('id').primaryKey().$defaultFn(() => crypto.randomUUID()),
  name: text('name'),
  email: text('email').notNull().unique(),
  emailVerified: timestamp('email_verified', { mode: 'date', withTimezone: true }),
  image: text('image'),
  passwordHash: text('password_hash'),
  isAdmin: boolean('is_admin').notNull().default(false),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const accounts = pgTable(
  'accounts',
  {
    userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    type: text('type').notNull(),
    provider: text('provider').notNull(),
    providerAccountId: text('provider_account_id').notNull(),
    refresh_token: text('refresh_token'),
    access_token: text('access_token'),
    expires_at: integer('expires_at'),
    token_type: text('token_type'),
    scope: text('scope'),
    id_token: text('id_token'),
    session_state: text('session_state'),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] })],
);

export const sessions = pgTable('sessions', {
  sessionToken: text('session_token').primaryKey(),
  userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
});

export const verificationTokens = pgTable(
  'verification_tokens',
  {
    identifier: text('identifier').notNull(),
    token: text('token').notNull(),
    expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

// ---------------------------------------------------------------------------------------------
// Manuscripts and who works on them
// ---------------------------------------------------------------------------------------------

export const manuscripts = pgTable('manuscripts', {
  id: uuid('id').primaryKey().defaultRandom(),
  title: text('title').notNull(),
  slug: text('slug').notNull().unique(),
  abstract: text('abstract').notNull().default(''),
  status: manuscriptStatus('status').notNull().default('draft'),
  archivedAt: timestamp('archived_at', { withTimezone: true }),
  createdById: text('created_by_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    manuscriptId: uuid('manuscript_id').notNull().references(() => manuscripts.id, { onDelete: 'cascade' }),
    userId: text('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    role: memberRole('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.manuscriptId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

/** An owner's invitation: the link carries a random token; only its SHA-256 is stored. */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    manuscriptId: uuid('manuscript_id').notNull().references(() => manuscripts.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: memberRole('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedById: text('invited_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedById: text('accepted_by_id').references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('invitations_manuscript_idx').on(t.manuscriptId)],
);

// ---------------------------------------------------------------------------------------------
// Figure notes (MDX) with revision history
// ---------------------------------------------------------------------------------------------

export const notes = pgTable(
  'notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    manuscriptId: uuid('manuscript_id').notNull().references(() => manuscripts.id, { onDelete: 'cascade' }),
    slug: text('slug').notNull(),
    title: text('title').notNull(),
    source: text('source').notNull().default(''),
    position: integer('position').notNull().default(0),
    revision: integer('revision').notNull().default(1),
    updatedById: text('updated_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('notes_manuscript_slug_idx').on(t.manuscriptId, t.slug)],
);

export const noteRevisions = pgTable(
  'note_revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    noteId: uuid('note_id').notNull().references(() => notes.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    title: text('title').notNull(),
    source: text('source').notNull(),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('note_revisions_note_number_idx').on(t.noteId, t.number)],
);

// ---------------------------------------------------------------------------------------------
// Figures, runs, cached results and snapshots
// ---------------------------------------------------------------------------------------------

/** A figure of a manuscript. `kind` is a kind of the figure-kind registry; `params` are valid for that kind's schema. */
export const figures = pgTable(
  'figures',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    manuscriptId: uuid('manuscript_id').notNull().references(() => manuscripts.id, { onDelete: 'cascade' }),
    label: text('label').notNull(),
    kind: text('kind').$type<FigureKind>().notNull(),
    title: text('title').notNull().default(''),
    caption: text('caption').notNull().default(''),
    params: jsonb('params').$type<FigureParams>().notNull(),
    viewSpec: jsonb('view_spec'),
    createdById: text('created_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('figures_manuscript_label_idx').on(t.manuscriptId, t.label)],
);

/**
 * A computed result, shared by every run with the same input: `inputHash` = SHA-256 of the canonical
 * JSON of (params, solver version); `resultHash` = SHA-256 of the canonical result without diagnostics.
 */
export const results = pgTable('results', {
  id: uuid('id').primaryKey().defaultRandom(),
  inputHash: text('input_hash').notNull().unique(),
  solverVersion: text('solver_version').notNull(),
  params: jsonb('params').$type<TaskSpec>().notNull(),
  data: jsonb('data').notNull(),
  diagnostics: jsonb('diagnostics').notNull(),
  resultHash: text('result_hash').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const runs = pgTable(
  'runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    figureId: uuid('figure_id').notNull().references(() => figures.id, { onDelete: 'cascade' }),
    params: jsonb('params').$type<TaskSpec>().notNull(),
    inputHash: text('input_hash').notNull(),
    solverVersion: text('solver_version').notNull(),
    status: runStatus('status').notNull().default('queued'),
    progress: doublePrecision('progress').notNull().default(0),
    message: text('message').notNull().default(''),
    error: text('error'),
    jobId: text('job_id'),
    resultId: uuid('result_id').references(() => results.id, { onDelete: 'restrict' }),
    fromCache: boolean('from_cache').notNull().default(false),
    startedById: text('started_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('runs_figure_idx').on(t.figureId, t.createdAt)],
);

/** An immutable, numbered version of a figure. The database refuses UPDATE and DELETE (migration trigger). */
export const snapshots = pgTable(
  'snapshots',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    figureId: uuid('figure_id').notNull().references(() => figures.id, { onDelete: 'restrict' }),
    manuscriptId: uuid('manuscript_id').notNull().references(() => manuscripts.id, { onDelete: 'restrict' }),
    version: integer('version').notNull(),
    kind: text('kind').$type<FigureKind>().notNull(),
    label: text('label').notNull(),
    caption: text('caption').notNull(),
    params: jsonb('params').$type<FigureParams>().notNull(),
    viewSpec: jsonb('view_spec'),
    solverVersion: text('solver_version').notNull(),
    gitCommit: text('git_commit'),
    resultId: uuid('result_id').notNull().references(() => results.id, { onDelete: 'restrict' }),
    resultHash: text('result_hash').notNull(),
    runId: uuid('run_id').references(() => runs.id, { onDelete: 'set null' }),
    frozenById: text('frozen_by_id').references(() => users.id, { onDelete: 'set null' }),
    frozenAt: timestamp('frozen_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('snapshots_figure_version_idx').on(t.figureId, t.version)],
);

// ---------------------------------------------------------------------------------------------
// Rate limits (shared by every app process: the counting happens in PostgreSQL)
// ---------------------------------------------------------------------------------------------

/**
 * One counted attempt in a rate-limit bucket (`password-account`, `invitation-manuscript`, …) for a key (an e-mail, a
 * client address, a manuscript id). A limit counts the rows of (bucket, key) younger than its window; old rows are pruned.
 */
export const rateLimitEvents = pgTable(
  'rate_limit_events',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    bucket: text('bucket').notNull(),
    key: text('key').notNull(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('rate_limit_events_bucket_key_at_idx').on(t.bucket, t.key, t.at), index('rate_limit_events_at_idx').on(t.at)],
);

// ---------------------------------------------------------------------------------------------
// Relations
// ---------------------------------------------------------------------------------------------

export const usersRelations = relations(users, ({ many }) => ({ memberships: many(memberships) }));
export const manuscriptsRelations = relations(manuscripts, ({ many }) => ({
  memberships: many(memberships),
  notes: many(notes),
  figures: many(figures),
}));
export const membershipsRelations = relations(memberships, ({ one }) => ({
  manuscript: one(manuscripts, { fields: [memberships.manuscriptId], references: [manuscripts.id] }),
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
}));
export const figuresRelations = relations(figures, ({ one, many }) => ({
  manuscript: one(manuscripts, { fields: [figures.manuscriptId], references: [manuscripts.id] }),
  runs: many(runs),
  snapshots: many(snapshots),
}));
export const runsRelations = relations(runs, ({ one }) => ({
  figure: one(figures, { fields: [runs.figureId], references: [figures.id] }),
  result: one(results, { fields: [runs.resultId], references: [results.id] }),
}));
export const snapshotsRelations = relations(snapshots, ({ one }) => ({
  figure: one(figures, { fields: [snapshots.figureId], references: [figures.id] }),
  result: one(results, { fields: [snapshots.resultId], references: [results.id] }),
}));

// ---------------------------------------------------------------------------------------------
// Row types
// ---------------------------------------------------------------------------------------------

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Manuscript = typeof manuscripts.$inferSelect;
export type NewManuscript = typeof manuscripts.$inferInsert;
export type Membership = typeof memberships.$inferSelect;
export type MemberRole = (typeof memberRole.enumValues)[number];
export type ManuscriptStatus = (typeof manuscriptStatus.enumValues)[number];
export type Invitation = typeof invitations.$inferSelect;
export type Note = typeof notes.$inferSelect;
export type NoteRevision = typeof noteRevisions.$inferSelect;
export type Figure = typeof figures.$inferSelect;
export type Run = typeof runs.$inferSelect;
export type Result = typeof results.$inferSelect;
export type Snapshot = typeof snapshots.$inferSelect;
export type RateLimitEvent = typeof rateLimitEvents.$inferSelect;

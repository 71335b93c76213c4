import { boolean, date, index, integer, jsonb, pgTable, primaryKey, real, serial, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import type { WizardInput, WizardResult } from '@/lib/wizard/types';
import type { PhoneResult } from '@/lib/validation/offline';
import type { SpeciesRecord } from '@/lib/validation/species';

// Every table of Candlewise lives here so that migrations come from one place (drizzle-kit generate).

export const roles = ['member', 'editor', 'librarian', 'admin'] as const;
export type Role = (typeof roles)[number];

export const users = pgTable('users', {
  id: text('id')
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID()),
  name: text('name'),
  email: text('email').notNull().unique(),
  emailVerified: timestamp('email_verified', { mode: 'date' }),
  image: text('image'),
  passwordHash: text('password_hash'),
  role: text('role').$type<Role>().notNull().default('member'),
  disabled: boolean('disabled').notNull().default(false),
  // Bumped on sign-out, role change and disable: tokens carrying an older version stop working.
  tokenVersion: integer('token_version').notNull().default(0),
  digestOptIn: boolean('digest_opt_in').notNull().default(false),
  /** The weekly e-mail of this week's tasks on the member's trees (off until the member turns it on). */
  reminderOptIn: boolean('reminder_opt_in').notNull().default(false),
  createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
});

export const accounts = pgTable(
  'accounts',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
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
  userId: text('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  expires: timestamp('expires', { mode: 'date' }).notNull(),
});

export const verificationTokens = pgTable(
  'verification_tokens',
  {
    identifier: text('identifier').notNull(),
    token: text('token').notNull(),
    expires: timestamp('expires', { mode: 'date' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

// A sign-up waits here until the owner of the address opens the link mailed to it; only then is
// the account created. Each row carries its own password hash, so a later sign-up for the same
// address (by anyone) never changes what an earlier link creates.
export const pendingSignUps = pgTable(
  'pending_sign_ups',
  {
    tokenHash: text('token_hash').primaryKey(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    passwordHash: text('password_hash').notNull(),
    expiresAt: timestamp('expires_at', { mode: 'date', withTimezone: true }).notNull(),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('pending_sign_ups_email_idx').on(t.email)],
);

export const clubSettings = pgTable('club_settings', {
  id: integer('id').primaryKey().default(1),
  clubName: text('club_name').notNull().default('Our bonsai club'),
  hemisphere: text('hemisphere').$type<'north' | 'south'>().notNull().default('north'),
  defaultLatitude: real('default_latitude').notNull().default(45),
  /** Shift of the wizard's decandle window for the club's local season, in days (−30 to +30). */
  decandleOffsetDays: integer('decandle_offset_days').notNull().default(0),
  updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
});

export const outboxMessages = pgTable(
  'outbox_messages',
  {
    id: serial('id').primaryKey(),
    envelopeFrom: text('envelope_from').notNull(),
    envelopeTo: jsonb('envelope_to').$type<string[]>().notNull(),
    subject: text('subject').notNull().default(''),
    text: text('text'),
    html: text('html'),
    raw: text('raw').notNull(),
    receivedAt: timestamp('received_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    // The message's Message-ID: a message handed over again after a crash (same id) is stored once.
    messageId: text('message_id'),
  },
  (t) => [index('outbox_received_idx').on(t.receivedAt), uniqueIndex('outbox_message_id_idx').on(t.messageId)],
);

// Species: one row per species with the published revision's searchable fields denormalised,
// and every revision (draft or published) kept in species_revisions.
export const species = pgTable('species', {
  id: serial('id').primaryKey(),
  slug: text('slug').notNull().unique(),
  botanicalName: text('botanical_name').notNull(),
  commonNames: jsonb('common_names').$type<string[]>().notNull().default([]),
  synonyms: jsonb('synonyms').$type<string[]>().notNull().default([]),
  genus: text('genus').notNull(),
  group: text('group').notNull(),
  flushHabit: text('flush_habit').$type<'single' | 'double' | 'polycyclic'>(),
  vigour: text('vigour').$type<'low' | 'moderate' | 'high'>(),
  needleMinMm: real('needle_min_mm'),
  needleMaxMm: real('needle_max_mm'),
  publishedRevision: integer('published_revision'),
  latestRevision: integer('latest_revision').notNull().default(0),
  createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
});

export const speciesRevisions = pgTable(
  'species_revisions',
  {
    id: serial('id').primaryKey(),
    speciesId: integer('species_id')
      .notNull()
      .references(() => species.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    status: text('status').$type<'draft' | 'published'>().notNull(),
    // Written from a checked record; read back through speciesRecordSchema, since older revisions
    // may predate a field.
    data: jsonb('data').$type<SpeciesRecord>().notNull(),
    body: text('body').notNull().default(''),
    summary: text('summary').notNull().default(''),
    editorId: text('editor_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('species_revision_uq').on(t.speciesId, t.revision)],
);

export const trees = pgTable(
  'trees',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    speciesSlug: text('species_slug').notNull(),
    stageNotes: text('stage_notes').notNull().default(''),
    containerShape: text('container_shape').$type<'round' | 'rectangle' | 'oval'>(),
    containerLengthCm: real('container_length_cm'),
    containerWidthCm: real('container_width_cm'),
    acquiredOn: date('acquired_on'),
    collectedFromWild: boolean('collected_from_wild').notNull().default(false),
    collectedOn: date('collected_on'),
    notes: text('notes').notNull().default(''),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('trees_owner_idx').on(t.ownerId, t.createdAt)],
);

export const answers = pgTable(
  'answers',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    treeId: text('tree_id').references(() => trees.id, { onDelete: 'set null' }),
    speciesSlug: text('species_slug').notNull(),
    speciesRevision: integer('species_revision').notNull(),
    engineVersion: text('engine_version').notNull(),
    action: text('action').notNull(),
    stage: text('stage').notNull(),
    season: text('season').notNull(),
    observedOn: date('observed_on').notNull(),
    input: jsonb('input').$type<WizardInput>().notNull(),
    result: jsonb('result').$type<WizardResult>().notNull(),
    note: text('note').notNull().default(''),
    followUp: text('follow_up').notNull().default(''),
    visibility: text('visibility').$type<'private' | 'club'>().notNull().default('private'),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    // The client's Idempotency-Key: a retried save (an offline queue replaying) finds its first answer.
    idempotencyKey: text('idempotency_key'),
    // What the phone worked out offline, when it differs from the server's re-evaluation.
    phoneResult: jsonb('phone_result').$type<PhoneResult>(),
  },
  (t) => [
    uniqueIndex('answers_user_idempotency_idx').on(t.userId, t.idempotencyKey),
    index('answers_user_created_idx').on(t.userId, t.createdAt.desc(), t.id.desc()),
    index('answers_visibility_created_idx').on(t.visibility, t.createdAt.desc()),
    index('answers_tree_idx').on(t.treeId),
  ],
);

export const notes = pgTable(
  'notes',
  {
    id: serial('id').primaryKey(),
    slug: text('slug').notNull().unique(),
    title: text('title').notNull(),
    meetingDate: date('meeting_date').notNull(),
    body: text('body').notNull().default(''),
    status: text('status').$type<'draft' | 'published'>().notNull().default('draft'),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    publishedAt: timestamp('published_at', { mode: 'date', withTimezone: true }),
  },
  (t) => [index('notes_meeting_idx').on(t.meetingDate)],
);

// Which notes link which answers and species; rewritten whenever a note is saved.
export const noteLinks = pgTable(
  'note_links',
  {
    noteId: integer('note_id')
      .notNull()
      .references(() => notes.id, { onDelete: 'cascade' }),
    targetType: text('target_type').$type<'answer' | 'species'>().notNull(),
    targetId: text('target_id').notNull(),
    // Copies of the note's meeting date and published state (lib/data/notes.ts keeps them in step),
    // so a page's backlinks are the first rows of one index instead of a scan of every note.
    meetingDate: date('meeting_date'),
    published: boolean('published').notNull().default(false),
  },
  (t) => [
    primaryKey({ columns: [t.noteId, t.targetType, t.targetId] }),
    index('note_links_target_idx').on(t.targetType, t.targetId),
    index('note_links_backlinks_idx').on(t.targetType, t.targetId, t.published, t.meetingDate.desc(), t.noteId.desc()),
  ],
);

export const digestSends = pgTable(
  'digest_sends',
  {
    id: serial('id').primaryKey(),
    noteId: integer('note_id')
      .notNull()
      .references(() => notes.id, { onDelete: 'cascade' }),
    senderId: text('sender_id').references(() => users.id, { onDelete: 'set null' }),
    recipients: integer('recipients').notNull(),
    sentAt: timestamp('sent_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('digest_sends_note_idx').on(t.noteId)],
);

export const photos = pgTable(
  'photos',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    answerId: text('answer_id').references(() => answers.id, { onDelete: 'cascade' }),
    treeId: text('tree_id').references(() => trees.id, { onDelete: 'cascade' }),
    storageKey: text('storage_key').notNull(),
    thumbKey: text('thumb_key').notNull(),
    mime: text('mime').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('photos_answer_idx').on(t.answerId), index('photos_tree_idx').on(t.treeId)],
);

// Temperature records for the season's heat sums: one club-wide record (kept by a librarian or an
// admin) and at most one per member. `scopeKey` is 'club' or 'member:<user id>'.
export const temperatureRecords = pgTable('temperature_records', {
  id: text('id').primaryKey(),
  scopeKey: text('scope_key').notNull().unique(),
  ownerId: text('owner_id').references(() => users.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
});

// One row per day of a record; re-importing a day replaces it.
export const temperatureDays = pgTable(
  'temperature_days',
  {
    recordId: text('record_id')
      .notNull()
      .references(() => temperatureRecords.id, { onDelete: 'cascade' }),
    day: date('day').notNull(),
    tmin: real('tmin').notNull(),
    tmax: real('tmax').notNull(),
  },
  (t) => [primaryKey({ columns: [t.recordId, t.day] })],
);

// What a member saw on a tree ("candles extending today") or marked done, re-anchoring its plan.
export const treeObservations = pgTable(
  'tree_observations',
  {
    id: serial('id').primaryKey(),
    treeId: text('tree_id')
      .notNull()
      .references(() => trees.id, { onDelete: 'cascade' }),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    observedOn: date('observed_on').notNull(),
    shoot: text('shoot'),
    task: text('task'),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('tree_observations_tree_idx').on(t.treeId, t.observedOn)],
);

// The job queue (lib/queue): one row per job. A worker claims the oldest due job with
// FOR UPDATE SKIP LOCKED and holds it for a lease; a job whose lease ran out (its worker died) is
// claimed again. `dedupeKey` makes enqueuing the same piece of work twice a no-op.
export const jobs = pgTable(
  'jobs',
  {
    id: serial('id').primaryKey(),
    queue: text('queue').notNull(),
    payload: jsonb('payload').$type<Record<string, unknown>>().notNull(),
    state: text('state').$type<'queued' | 'active' | 'done' | 'failed'>().notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    maxAttempts: integer('max_attempts').notNull().default(5),
    runAt: timestamp('run_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    lockedUntil: timestamp('locked_until', { mode: 'date', withTimezone: true }),
    lastError: text('last_error'),
    dedupeKey: text('dedupe_key'),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { mode: 'date', withTimezone: true }),
  },
  (t) => [index('jobs_due_idx').on(t.state, t.runAt), uniqueIndex('jobs_dedupe_idx').on(t.dedupeKey)],
);

// A weekly reminder run an administrator started, and one ledger row per member and week: the row
// is what makes a reminder go out at most once a week per member, however often the week is run.
export const reminderRuns = pgTable(
  'reminder_runs',
  {
    id: text('id').primaryKey(),
    weekOf: date('week_of').notNull(),
    requestedBy: text('requested_by').references(() => users.id, { onDelete: 'set null' }),
    /** Members the run looks at; null until the run has listed them. */
    total: integer('total'),
    createdAt: timestamp('created_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('reminder_runs_created_idx').on(t.createdAt)],
);

export const reminderSends = pgTable(
  'reminder_sends',
  {
    id: serial('id').primaryKey(),
    weekOf: date('week_of').notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** The run that settled this member's week. */
    runId: text('run_id')
      .notNull()
      .references(() => reminderRuns.id, { onDelete: 'cascade' }),
    // sending: handed to SMTP, not yet confirmed; sent; skipped (nothing due, opted out); failed.
    state: text('state').$type<'sending' | 'sent' | 'skipped' | 'failed'>().notNull(),
    reason: text('reason'),
    messageId: text('message_id'),
    tasks: integer('tasks').notNull().default(0),
    updatedAt: timestamp('updated_at', { mode: 'date', withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('reminder_sends_week_user_uq').on(t.weekOf, t.userId), index('reminder_sends_run_idx').on(t.runId)],
);

// Which run looked at which member (a member settled by an earlier run of the same week counts as
// skipped in the later run).
export const reminderRunMembers = pgTable(
  'reminder_run_members',
  {
    runId: text('run_id')
      .notNull()
      .references(() => reminderRuns.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    outcome: text('outcome').$type<'sent' | 'skipped' | 'failed'>(),
    reason: text('reason'),
  },
  (t) => [primaryKey({ columns: [t.runId, t.userId] })],
);

// Sign-in, sign-in link and sign-up limits when several server processes share one PostgreSQL
// (lib/data/rate-limits.ts; on PGlite the counts stay in process memory). One row per key and fixed
// window: `hits` is raised in one upsert, and `expiresAt` (two windows on) is when the row may go.
export const rateLimits = pgTable(
  'rate_limits',
  {
    key: text('key').notNull(),
    windowStart: timestamp('window_start', { mode: 'date', withTimezone: true }).notNull(),
    hits: integer('hits').notNull(),
    expiresAt: timestamp('expires_at', { mode: 'date', withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.key, t.windowStart] }), index('rate_limits_expires_idx').on(t.expiresAt)],
);

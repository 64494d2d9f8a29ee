/**
 * The whole database schema, one table per concern. Migrations in ./drizzle are generated from
 * this file with `npm run db:generate` and committed; never edit a committed migration.
 *
 * Ids: shops and shop data use auto-increment bigint unsigned ids; users use random string ids because
 * the session library expects them. Lengths stored here are in the design's own units.
 */
import { sql } from 'drizzle-orm';
import { ROLES } from '~/lib/schemas/account.ts';
import { STORED_BOARD_STATUSES, REVISION_REASONS } from '~/lib/schemas/board.ts';
import { REFUND_STATUSES } from '~/lib/schemas/deposit.ts';
import { templateConditionSchema } from '~/lib/schemas/template.ts';
import {
  bigint,
  boolean,
  char,
  date,
  datetime,
  double,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  text,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';

// MariaDB rejects drizzle's `serial AUTO_INCREMENT`, so ids are spelled out.
const idColumn = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();
const now = () => datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`);
const shopRef = () =>
  bigint('shop_id', { mode: 'number', unsigned: true })
    .notNull()
    .references(() => shops.id, { onDelete: 'cascade' });
const userRef = (name: string) => varchar(name, { length: 40 });

// The enums come from the browser-safe schemas, so forms, API and database share one list each.
export { ROLES, type Role } from '~/lib/schemas/account.ts';

export const shops = mysqlTable('shops', {
  id: idColumn(),
  name: varchar('name', { length: 120 }).notNull(),
  /** IANA time zone the shop's e-mails and pages write dates in (set by the Owner on Members). */
  timeZone: varchar('time_zone', { length: 64 }).notNull().default('UTC'),
  /** ISO 4217 code a deposit is asked in unless the builder names another (set by the Owner on Members). */
  currency: char('currency', { length: 3 }).notNull().default('USD'),
  createdAt: now(),
});

/** One user belongs to one shop with one role. E-mail is stored lower-cased and unique. */
export const users = mysqlTable(
  'users',
  {
    id: varchar('id', { length: 40 }).primaryKey(),
    shopId: shopRef(),
    email: varchar('email', { length: 254 }).notNull(),
    displayName: varchar('display_name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 255 }).notNull(),
    role: mysqlEnum('role', ROLES).notNull(),
    preferredUnits: mysqlEnum('preferred_units', ['mm', 'in']).notNull().default('mm'),
    createdAt: now(),
  },
  (t) => [uniqueIndex('users_email_uq').on(t.email), index('users_shop_idx').on(t.shopId)],
);

/** Sign-in sessions (the shape the session library's adapter expects). */
export const sessions = mysqlTable(
  'sessions',
  {
    id: varchar('id', { length: 255 }).primaryKey(),
    userId: userRef('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

export const TOKEN_KINDS = ['invite', 'reset', 'new-shop'] as const;

/**
 * Single-use links (invitations, password resets, and the link that finishes creating a shop).
 * Only the SHA-256 of the token is stored. A `new-shop` link has no shop yet: it carries the
 * shop's name, and the shop row is made only when the link is used.
 */
export const oneTimeTokens = mysqlTable(
  'one_time_tokens',
  {
    id: idColumn(),
    kind: mysqlEnum('kind', TOKEN_KINDS).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    /** Null only for `new-shop` links. */
    shopId: bigint('shop_id', { mode: 'number', unsigned: true }).references(() => shops.id, { onDelete: 'cascade' }),
    /** The name of the shop a `new-shop` link creates; null for every other kind. */
    shopName: varchar('shop_name', { length: 120 }),
    userId: userRef('user_id'),
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', ROLES),
    createdBy: userRef('created_by'),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
    usedAt: datetime('used_at', { mode: 'date' }),
    revokedAt: datetime('revoked_at', { mode: 'date' }),
    createdAt: now(),
  },
  (t) => [uniqueIndex('tokens_hash_uq').on(t.tokenHash), index('tokens_shop_idx').on(t.shopId, t.kind)],
);

export { STORED_BOARD_STATUSES, type StoredBoardStatus } from '~/lib/schemas/board.ts';

/**
 * A board's head row. The working copy (what the editor autosaves) lives here; revisions are the
 * checkpoints in board_revisions. `workingRevision` names the revision the working copy equals
 * exactly (null: it has changes not yet in a revision). Fingerprints are designFingerprint()'s.
 */
export const boards = mysqlTable(
  'boards',
  {
    id: idColumn(),
    shopId: shopRef(),
    name: varchar('name', { length: 120 }).notNull(),
    instrumentType: varchar('instrument_type', { length: 40 }).notNull().default('guitar'),
    clientName: varchar('client_name', { length: 120 }).notNull().default(''),
    units: mysqlEnum('units', ['mm', 'in']).notNull(),
    /** Scale lengths copied from the current revision, in mm, so lists can sort by scale. */
    trebleScaleMm: double('treble_scale_mm').notNull(),
    bassScaleMm: double('bass_scale_mm').notNull(),
    status: mysqlEnum('status', STORED_BOARD_STATUSES).notNull().default('draft'),
    archivedAt: datetime('archived_at', { mode: 'date', fsp: 3 }),
    /** The newest revision's number (the working copy may be ahead of it). */
    currentRevision: int('current_revision').notNull().default(1),
    /** The working copy's design JSON; null only on rows the start-up backfill has not reached. */
    workingData: json('working_data'),
    workingRevision: int('working_revision'),
    workingFingerprint: char('working_fingerprint', { length: 14 }),
    /** The client's standing approval (boardApproval() in lib/proofs): which revision, which layout. */
    approvedRevision: int('approved_revision'),
    approvedFingerprint: char('approved_fingerprint', { length: 14 }),
    /** Optimistic concurrency: every write bumps it; a write naming an older one gets 409. */
    version: int('version').notNull().default(1),
    createdBy: userRef('created_by').notNull(),
    updatedBy: userRef('updated_by').notNull(),
    createdAt: now(),
    updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    index('boards_shop_updated_idx').on(t.shopId, t.updatedAt),
    index('boards_shop_name_idx').on(t.shopId, t.name),
    index('boards_shop_status_idx').on(t.shopId, t.status, t.updatedAt),
    index('boards_shop_scale_idx').on(t.shopId, t.trebleScaleMm),
  ],
);

export { REVISION_REASONS } from '~/lib/schemas/board.ts';

/** A checkpoint of a board's design; rows are never updated (the start-up backfill sets a missing fingerprint once). */
export const boardRevisions = mysqlTable(
  'board_revisions',
  {
    id: idColumn(),
    boardId: bigint('board_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => boards.id, { onDelete: 'cascade' }),
    revision: int('revision').notNull(),
    data: json('data').notNull(),
    note: varchar('note', { length: 500 }).notNull().default(''),
    /** Why the revision was made: saved by a person, or made for a proof, an export, a restore… */
    reason: mysqlEnum('reason', REVISION_REASONS).notNull().default('saved'),
    fingerprint: char('fingerprint', { length: 14 }),
    authorId: userRef('author_id').notNull(),
    createdAt: now(),
  },
  (t) => [uniqueIndex('revisions_board_rev_uq').on(t.boardId, t.revision)],
);

/** A proof pins one revision for a client; the link token is stored only as its SHA-256. */
export const proofs = mysqlTable(
  'proofs',
  {
    id: idColumn(),
    shopId: shopRef(),
    boardId: bigint('board_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => boards.id, { onDelete: 'cascade' }),
    revision: int('revision').notNull(),
    /** The pinned revision's fingerprint, so an approval can be compared with the board as it is now. */
    fingerprint: char('fingerprint', { length: 14 }),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    clientName: varchar('client_name', { length: 120 }).notNull(),
    clientEmail: varchar('client_email', { length: 254 }).notNull(),
    message: text('message').notNull(),
    expiresAt: datetime('expires_at', { mode: 'date' }).notNull(),
    revokedAt: datetime('revoked_at', { mode: 'date' }),
    createdBy: userRef('created_by').notNull(),
    createdAt: now(),
    decision: mysqlEnum('decision', ['approved', 'changes_requested']),
    decidedAt: datetime('decided_at', { mode: 'date' }),
    decidedName: varchar('decided_name', { length: 120 }),
    decisionComment: text('decision_comment'),
  },
  (t) => [uniqueIndex('proofs_token_uq').on(t.tokenHash), index('proofs_board_idx').on(t.shopId, t.boardId)],
);

export const TEMPLATE_CONDITIONS = templateConditionSchema.options;

/** A physical index template on the shop's shelf. */
export const templates = mysqlTable(
  'templates',
  {
    id: idColumn(),
    shopId: shopRef(),
    name: varchar('name', { length: 120 }).notNull(),
    boardId: bigint('board_id', { mode: 'number', unsigned: true }),
    revision: int('revision'),
    units: mysqlEnum('units', ['mm', 'in']).notNull(),
    trebleScale: double('treble_scale').notNull(),
    bassScale: double('bass_scale').notNull(),
    frets: int('frets').notNull(),
    slotWidth: double('slot_width').notNull(),
    keyWidth: double('key_width').notNull(),
    material: varchar('material', { length: 80 }).notNull().default(''),
    storagePlace: varchar('storage_place', { length: 80 }).notNull().default(''),
    condition: mysqlEnum('condition', TEMPLATE_CONDITIONS).notNull().default('in_use'),
    madeOn: date('made_on', { mode: 'string' }),
    lastCheckedOn: datetime('last_checked_on', { mode: 'date' }),
    lastCheckPassed: boolean('last_check_passed'),
    notes: text('notes').notNull(),
    createdAt: now(),
    updatedAt: datetime('updated_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [index('templates_shop_idx').on(t.shopId, t.updatedAt)],
);

/** One saved Template check: the measurements, the comparison and the verdict. */
export const templateChecks = mysqlTable(
  'template_checks',
  {
    id: idColumn(),
    shopId: shopRef(),
    templateId: bigint('template_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => templates.id, { onDelete: 'cascade' }),
    checkedBy: userRef('checked_by').notNull(),
    tolerance: double('tolerance').notNull(),
    passed: boolean('passed').notNull(),
    result: json('result').notNull(),
    createdAt: now(),
  },
  (t) => [index('checks_template_idx').on(t.shopId, t.templateId)],
);

/**
 * Rate limit counters shared by every app process (src/lib/http/rate-limit.server.ts). The column
 * names, types and their order are the ones rate-limiter-flexible's MySQL store writes with
 * `INSERT ... VALUES (key, points, expire)`; it is told the table exists (`tableCreated: true`).
 * `expire` is milliseconds since the Unix epoch; rows past it are stale and swept by the store.
 */
export const rateLimits = mysqlTable('rate_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: int('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number', unsigned: true }),
});

/**
 * The fret wire a shop uses (its Fret wire list): sizes and stock length in millimetres, and where
 * the sizes come from ("maker's sheet", "measured", "from memory"). A board names one by id.
 */
export const fretWires = mysqlTable(
  'fret_wires',
  {
    id: idColumn(),
    shopId: shopRef(),
    name: varchar('name', { length: 80 }).notNull(),
    crownWidthMm: double('crown_width_mm').notNull(),
    crownHeightMm: double('crown_height_mm').notNull(),
    tangWidthMm: double('tang_width_mm').notNull(),
    tangDepthMm: double('tang_depth_mm').notNull(),
    barbWidthMm: double('barb_width_mm').notNull(),
    stockLengthMm: double('stock_length_mm').notNull(),
    source: varchar('source', { length: 120 }).notNull().default(''),
    createdAt: now(),
  },
  (t) => [uniqueIndex('fret_wires_shop_name_uq').on(t.shopId, t.name)],
);

/**
 * A deposit the client is asked to pay on approving a proof (docs/payments.md): one per proof,
 * in integer minor units of an ISO 4217 currency.
 */
export const deposits = mysqlTable(
  'deposits',
  {
    id: idColumn(),
    shopId: shopRef(),
    proofId: bigint('proof_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => proofs.id, { onDelete: 'cascade' }),
    amountMinor: int('amount_minor', { unsigned: true }).notNull(),
    currency: char('currency', { length: 3 }).notNull(),
    description: varchar('description', { length: 200 }).notNull().default(''),
    createdBy: userRef('created_by').notNull(),
    createdAt: now(),
  },
  (t) => [uniqueIndex('deposits_proof_uq').on(t.proofId)],
);

/** A payment the service confirmed by signed webhook: one per completed pay page, as the event said. */
export const depositPayments = mysqlTable(
  'deposit_payments',
  {
    id: idColumn(),
    shopId: shopRef(),
    depositId: bigint('deposit_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => deposits.id, { onDelete: 'cascade' }),
    sessionId: varchar('session_id', { length: 255 }).notNull(),
    paymentIntentId: varchar('payment_intent_id', { length: 255 }).notNull(),
    amountMinor: int('amount_minor', { unsigned: true }).notNull(),
    currency: char('currency', { length: 3 }).notNull(),
    paidAt: datetime('paid_at', { mode: 'date' }).notNull(),
    eventId: varchar('event_id', { length: 255 }).notNull(),
    createdAt: now(),
  },
  (t) => [uniqueIndex('deposit_payments_session_uq').on(t.sessionId), index('deposit_payments_intent_idx').on(t.paymentIntentId)],
);


/** A refund: pending from the SDK's answer when the owner asked, done or failed from its webhook. */
export const depositRefunds = mysqlTable(
  'deposit_refunds',
  {
    id: idColumn(),
    shopId: shopRef(),
    paymentId: bigint('payment_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => depositPayments.id, { onDelete: 'cascade' }),
    refundId: varchar('refund_id', { length: 255 }).notNull(),
    amountMinor: int('amount_minor', { unsigned: true }).notNull(),
    currency: char('currency', { length: 3 }).notNull(),
    status: mysqlEnum('status', REFUND_STATUSES).notNull(),
    /** Null for a refund made elsewhere (the service's dashboard) that only its webhook told us of. */
    requestedBy: userRef('requested_by'),
    requestedAt: datetime('requested_at', { mode: 'date' }),
    settledAt: datetime('settled_at', { mode: 'date' }),
    createdAt: now(),
  },
  (t) => [uniqueIndex('deposit_refunds_refund_uq').on(t.refundId), index('deposit_refunds_payment_idx').on(t.paymentId)],
);

/** Webhook events already handled, by the service's event id: a repeated delivery records nothing. */
export const paymentEvents = mysqlTable('payment_events', {
  eventId: varchar('event_id', { length: 255 }).primaryKey(),
  type: varchar('type', { length: 100 }).notNull(),
  receivedAt: datetime('received_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
});

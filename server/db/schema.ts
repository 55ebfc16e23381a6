// All tables of Stratavolt. drizzle-kit generates the SQL migrations in drizzle/ from this file.
import { sql } from 'drizzle-orm'
import {
  boolean, customType, doublePrecision, index, integer, jsonb, numeric, pgTable, serial, text, timestamp, uniqueIndex,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core'
import type { ImportSettings } from '../../shared/catalog/types'

/**
 * Money in the database: exact decimals, six places (prices are quoted in fractions of a cent). The app holds
 * money as a JS number rounded to those six places (shared/utils/money.ts); drizzle converts at the edge.
 */
const money = (name: string) => numeric(name, { precision: 18, scale: 6, mode: 'number' })

const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow()

export const users = pgTable('users', {
  id: serial('id').primaryKey(),
  email: text('email').notNull(),
  name: text('name').notNull(),
  role: text('role').notNull(),
  passwordHash: text('password_hash'),
  disabled: boolean('disabled').notNull().default(false),
  // Bumped on disable / password change: sessions carrying an older value stop working at once.
  sessionVersion: integer('session_version').notNull().default(1),
  lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
  // the person's choice for dates, numbers and money (en-GB, de-DE, sv-SE, en-US); null: the company default
  locale: text('locale'),
  createdAt: createdAt(),
}, t => [uniqueIndex('users_email_key').on(sql`lower(${t.email})`)])

export const oneTimeTokens = pgTable('one_time_tokens', {
  id: serial('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  purpose: text('purpose').notNull(), // 'invite' | 'reset'
  tokenHash: text('token_hash').notNull().unique(),
  expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  usedAt: timestamp('used_at', { withTimezone: true }),
  createdAt: createdAt(),
})

export const apiTokens = pgTable('api_tokens', {
  id: serial('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  name: text('name').notNull(),
  prefix: text('prefix').notNull(),
  tokenHash: text('token_hash').notNull().unique(),
  lastUsedAt: timestamp('last_used_at', { withTimezone: true }),
  revokedAt: timestamp('revoked_at', { withTimezone: true }),
  createdAt: createdAt(),
})

export const auditLog = pgTable('audit_log', {
  id: serial('id').primaryKey(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
  actorEmail: text('actor_email'),
  action: text('action').notNull(),
  subject: text('subject'),
  details: jsonb('details'),
  ip: text('ip'),
}, t => [index('audit_log_at_idx').on(t.at)])

export const sentMail = pgTable('sent_mail', {
  id: serial('id').primaryKey(),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  messageId: text('message_id'),
  attachments: jsonb('attachments').$type<string[]>().notNull().default([]),
  status: text('status').notNull(), // 'sent' | 'failed'
  error: text('error'),
})

export const designs = pgTable('designs', {
  id: serial('id').primaryKey(),
  name: text('name').notNull(),
  description: text('description').notNull().default(''),
  ownerId: integer('owner_id').references(() => users.id, { onDelete: 'set null' }),
  status: text('status').notNull().default('active'), // 'active' | 'archived'
  revision: integer('revision').notNull().default(1),
  topology: text('topology').notNull(),
  levels: integer('levels').notNull(),
  dcVoltage: doublePrecision('dc_voltage'),
  powerKw: doublePrecision('power_kw'),
  backToBack: boolean('back_to_back').notNull().default(false),
  input: jsonb('input').notNull(),
  // BOM settings: build quantity, spares, hand-added lines.
  bomSettings: jsonb('bom_settings').notNull().default({ buildQuantity: 10, sparesPercent: 5, manualLines: [] }),
  createdAt: createdAt(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
})

export const designRevisions = pgTable('design_revisions', {
  id: serial('id').primaryKey(),
  designId: integer('design_id').notNull().references(() => designs.id, { onDelete: 'cascade' }),
  revision: integer('revision').notNull(),
  name: text('name').notNull(),
  input: jsonb('input').notNull(),
  authorId: integer('author_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
}, t => [uniqueIndex('design_revisions_key').on(t.designId, t.revision)])

const bytea = customType<{ data: Buffer, driverData: Buffer }>({ dataType: () => 'bytea' })

/**
 * Answers computed from a saved design (its results, its assigned parts' summary), kept so that opening an unchanged
 * design serves the bytes again instead of computing them. `key` is a SHA-256 over the build, the kind and everything
 * the answer was computed from (the input; for the summary the assignments, part versions and catalogue generation),
 * so a changed design, catalogue or build simply has another key and never meets an old answer. Shared by every
 * instance; at most a few rows per design and kind are kept (server/services/answer-cache.ts).
 */
export const computedAnswers = pgTable('computed_answers', {
  key: text('key').primaryKey(),
  kind: text('kind').notNull(), // 'design-results' | 'parts-summary'
  designId: integer('design_id').notNull().references(() => designs.id, { onDelete: 'cascade' }),
  /** the JSON answer, gzipped when `gzip` */
  body: bytea('body').notNull(),
  gzip: boolean('gzip').notNull(),
  createdAt: createdAt(),
}, t => [index('computed_answers_design_idx').on(t.designId, t.kind, t.createdAt)])

export const catalogVersions = pgTable('catalog_versions', {
  id: serial('id').primaryKey(),
  number: integer('number').notNull().unique(),
  importId: integer('import_id'),
  note: text('note').notNull().default(''),
  partsAdded: integer('parts_added').notNull().default(0),
  partsUpdated: integer('parts_updated').notNull().default(0),
  /** Parts in the catalogue after this version (kept, so the parts browser need not count them). */
  partsTotal: integer('parts_total').notNull().default(0),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
})

export const catalogImports = pgTable('catalog_imports', {
  id: serial('id').primaryKey(),
  filename: text('filename').notNull(),
  storageKey: text('storage_key').notNull(),
  sizeBytes: integer('size_bytes').notNull(),
  status: text('status').notNull(), // 'preview' | 'committed' | 'discarded'
  sheetName: text('sheet_name'),
  headers: jsonb('headers').$type<string[]>().notNull().default([]),
  mapping: jsonb('mapping'),
  decimalSeparator: text('decimal_separator').notNull().default('.'),
  rowCount: integer('row_count').notNull().default(0),
  issueCount: integer('issue_count').notNull().default(0),
  catalogVersionId: integer('catalog_version_id').references(() => catalogVersions.id),
  uploadedBy: integer('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
  /** Reading choices beside the mapping: header row, per-column decimal marks, value mapping, constants. */
  settings: jsonb('settings').$type<ImportSettings>().notNull().default({}),
  /** Rows left out by a partial commit. */
  refusedCount: integer('refused_count').notNull().default(0),
  createdAt: createdAt(),
})

export const headerMappings = pgTable('header_mappings', {
  id: serial('id').primaryKey(),
  userId: integer('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  signature: text('signature').notNull(),
  mapping: jsonb('mapping').notNull(),
  /** Value mapping and constants remembered with the column mapping. */
  settings: jsonb('settings').$type<Pick<ImportSettings, 'valueMapping' | 'constants'>>().notNull().default({}),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('header_mappings_key').on(t.userId, t.signature)])

export const parts = pgTable('parts', {
  id: serial('id').primaryKey(),
  manufacturer: text('manufacturer').notNull(),
  partNumber: text('part_number').notNull(),
  /** partKey(manufacturer, partNumber) from shared/catalog/part-key.ts: the part's identity, written by the app. */
  key: text('key').notNull(),
  /**
   * Set by the re-keying migration (0008) on a part whose new key another, older part already had: the two were
   * one part under different spellings. Left for a component engineer to resolve (audit log: "Part key conflict"),
   * never merged silently; imports and look-ups by key find the older part.
   */
  keyConflictWith: integer('key_conflict_with').references((): AnyPgColumn => parts.id, { onDelete: 'set null' }),
  currentVersionId: integer('current_version_id'),
  approved: boolean('approved').notNull().default(false),
  createdAt: createdAt(),
}, t => [uniqueIndex('parts_key').on(t.key).where(sql`${t.keyConflictWith} is null`)])

/**
 * One row (id 1): `generation` goes up with every committed change to parts or part_versions (statement
 * triggers in the migration "catalog-state"). Each instance checks it per request, so a catalogue commit on
 * one instance is seen by matching on every other at once; the part cache in memory is only a copy.
 */
export const catalogState = pgTable('catalog_state', {
  id: integer('id').primaryKey(),
  generation: integer('generation').notNull().default(0),
})

export const partVersions = pgTable('part_versions', {
  id: serial('id').primaryKey(),
  partId: integer('part_id').notNull().references(() => parts.id, { onDelete: 'cascade' }),
  catalogVersionId: integer('catalog_version_id').notNull().references(() => catalogVersions.id),
  // Columns the parts browser filters and sorts on; the whole row is in data.
  partNumber: text('part_number').notNull(),
  manufacturer: text('manufacturer').notNull(),
  kind: text('kind').notNull(),
  packageConfig: text('package_config').notNull(),
  voltageRating: doublePrecision('voltage_rating'),
  currentRating: doublePrecision('current_rating'),
  unitPrice: money('unit_price'),
  currency: text('currency'),
  stock: integer('stock'),
  leadTimeDays: integer('lead_time_days'),
  lifecycle: text('lifecycle').notNull(),
  data: jsonb('data').notNull(),
  /** True for the version parts.current_version_id points at: the parts browser reads only these rows. */
  isCurrent: boolean('is_current').notNull().default(false),
  createdAt: createdAt(),
}, t => [
  index('part_versions_part_idx').on(t.partId),
  index('part_versions_kind_voltage_idx').on(t.kind, t.voltageRating),
  // One partial index per sort and filter the parts browser offers, over current versions only, so a
  // page at 100 000 parts with many versions each reads an index range, not the versions table.
  ...(['partNumber', 'manufacturer', 'kind', 'voltageRating', 'currentRating', 'unitPrice', 'stock', 'leadTimeDays', 'lifecycle'] as const)
    .map(key => index(`part_versions_current_${key}_idx`).on(t[key], t.partId).where(sql`${t.isCurrent}`)),
  index('part_versions_current_part_idx').on(t.partId).where(sql`${t.isCurrent}`),
  // Trigram indexes for the search box (ILIKE '%text%'); pg_trgm is created by the migration.
  index('part_versions_current_pn_trgm').using('gin', sql`${t.partNumber} gin_trgm_ops`).where(sql`${t.isCurrent}`),
  index('part_versions_current_mfr_trgm').using('gin', sql`${t.manufacturer} gin_trgm_ops`).where(sql`${t.isCurrent}`),
  index('part_versions_current_desc_trgm').using('gin', sql`(${t.data}->>'description') gin_trgm_ops`).where(sql`${t.isCurrent}`),
])

export const partAssignments = pgTable('part_assignments', {
  id: serial('id').primaryKey(),
  designId: integer('design_id').notNull().references(() => designs.id, { onDelete: 'cascade' }),
  side: text('side').notNull(), // 'machine' | 'grid' | 'dc-link'
  position: text('position').notNull(),
  partVersionId: integer('part_version_id').notNull().references(() => partVersions.id),
  seriesCount: integer('series_count').notNull().default(1),
  parallelCount: integer('parallel_count').notNull().default(1),
  // Design revision the counts were rated against; a newer revision re-rates them (issue 11 item 3).
  designRevision: integer('design_revision').notNull().default(1),
  // Revision at which an engineer confirmed an assignment that no longer fits (null = not confirmed).
  confirmedRevision: integer('confirmed_revision'),
  confirmedReason: text('confirmed_reason'),
  // Module coverage: the position on the same side whose package also fills this one (null = own part).
  coveredBy: text('covered_by'),
  assignedBy: integer('assigned_by').references(() => users.id, { onDelete: 'set null' }),
  assignedAt: timestamp('assigned_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('part_assignments_key').on(t.designId, t.side, t.position)])

// A design engineer's recorded reason to release a BOM line with an unapproved / NRND / obsolete part.
export const bomAcknowledgements = pgTable('bom_acknowledgements', {
  id: serial('id').primaryKey(),
  designId: integer('design_id').notNull().references(() => designs.id, { onDelete: 'cascade' }),
  lineKey: text('line_key').notNull(),
  /** part version the reason was given for: a different version needs a new acknowledgement */
  partVersionId: integer('part_version_id').notNull(),
  reason: text('reason').notNull(),
  acknowledgedBy: integer('acknowledged_by').references(() => users.id, { onDelete: 'set null' }),
  acknowledgedByName: text('acknowledged_by_name').notNull().default(''),
  acknowledgedAt: timestamp('acknowledged_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('bom_acknowledgements_key').on(t.designId, t.lineKey)])

// Mail written in the same transaction as what it reports; a worker on any instance sends it (FOR UPDATE SKIP LOCKED).
export const mailOutbox = pgTable('mail_outbox', {
  id: serial('id').primaryKey(),
  kind: text('kind').notNull(), // 'bom-released'
  to: text('to').notNull(),
  subject: text('subject').notNull(),
  payload: jsonb('payload').notNull(),
  status: text('status').notNull().default('pending'), // pending | sent | failed
  attempts: integer('attempts').notNull().default(0),
  nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
  lastError: text('last_error'),
  sentAt: timestamp('sent_at', { withTimezone: true }),
  createdAt: createdAt(),
}, t => [index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt)])

export const boms = pgTable('boms', {
  id: serial('id').primaryKey(),
  designId: integer('design_id').notNull().references(() => designs.id, { onDelete: 'cascade' }),
  revision: integer('revision').notNull(),
  designRevision: integer('design_revision').notNull(),
  status: text('status').notNull().default('released'), // released | quoted | ordered | received | cancelled
  snapshot: jsonb('snapshot').notNull(),
  changes: jsonb('changes'),
  releasedBy: integer('released_by').references(() => users.id, { onDelete: 'set null' }),
  releasedAt: timestamp('released_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('boms_key').on(t.designId, t.revision)])

export const bomPurchaseLines = pgTable('bom_purchase_lines', {
  id: serial('id').primaryKey(),
  bomId: integer('bom_id').notNull().references(() => boms.id, { onDelete: 'cascade' }),
  lineKey: text('line_key').notNull(),
  supplier: text('supplier'),
  quotedUnitPrice: money('quoted_unit_price'),
  orderReference: text('order_reference'),
  // Purchasing line status: to-quote | quoted | ordered | confirmed | received, with the date of each step.
  status: text('status').notNull().default('to-quote'),
  statusDates: jsonb('status_dates').$type<Record<string, string>>().notNull().default({}),
  quoteCurrency: text('quote_currency'),
  promisedDelivery: text('promised_delivery'),
  updatedBy: integer('updated_by').references(() => users.id, { onDelete: 'set null' }),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [uniqueIndex('bom_purchase_lines_key').on(t.bomId, t.lineKey)])

// Fixed-window counters for sign-in / reset throttling, shared by every app instance.
// One row per key (e.g. "signin:<e-mail>|<client>"); a hit is one atomic upsert.
export const throttleCounters = pgTable('throttle_counters', {
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: timestamp('reset_at', { withTimezone: true }).notNull(),
}, t => [index('throttle_counters_reset_idx').on(t.resetAt)])

// Sessions ended by sign-out before their cookie expires (session id from the sealed cookie).
// The guard refuses them on every instance; rows older than the session lifetime are dropped.
export const revokedSessions = pgTable('revoked_sessions', {
  sessionId: text('session_id').primaryKey(),
  userId: integer('user_id').references(() => users.id, { onDelete: 'cascade' }),
  revokedAt: timestamp('revoked_at', { withTimezone: true }).notNull().defaultNow(),
}, t => [index('revoked_sessions_at_idx').on(t.revokedAt)])

/**
 * Long work done on the job queue (pg-boss, any instance may work any job): what the UI polls for
 * progress and the result. `id` is ours; the pg-boss job carries it.
 */
export const backgroundJobs = pgTable('background_jobs', {
  id: text('id').primaryKey(),
  kind: text('kind').notNull(), // 'catalog-commit' | 'trade-study' | 'bom-pdf'
  status: text('status').notNull().default('queued'), // 'queued' | 'running' | 'done' | 'failed'
  /** 0…1 */
  progress: doublePrecision('progress').notNull().default(0),
  message: text('message').notNull().default(''),
  attempts: integer('attempts').notNull().default(0),
  input: jsonb('input'),
  result: jsonb('result'),
  /** `{ statusCode, message, data }` as the route would have answered */
  error: jsonb('error'),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
})

import { sql } from 'drizzle-orm';
import type { CoreShape } from '@shared/engine/types';
import {
  type AnyPgColumn,
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  json,
  jsonb,
  pgTable,
  serial,
  text,
  timestamp,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/pg-core';

export const users = pgTable(
  'users',
  {
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
  },
  (t) => [
    check('users_role_check', sql`${t.role} in ('engineer', 'reviewer', 'winder', 'admin')`),
    check('users_theme_check', sql`${t.theme} is null or ${t.theme} in ('light', 'dark')`),
  ],
);

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
  updatedAt: timestamp('updated_at', { withTimezone: true })
    .notNull()
    .default(sql`now()`),
});

/**
 * Core materials, versioned: every edit or re-upload adds a row with the same `lineage` and the next
 * `version`, and only the newest row is `current`. Designs point at the exact row they used.
 * Steinmetz k is kept as uploaded (with its unit set) and converted to SI (W/m³, Hz, T) for the engine.
 */
export const materials = pgTable(
  'materials',
  {
    id: serial('id').primaryKey(),
    lineage: varchar('lineage', { length: 80 }).notNull(),
    version: integer('version').notNull(),
    current: boolean('current').notNull().default(true),
    retired: boolean('retired').notNull().default(false),
    name: varchar('name', { length: 80 }).notNull(),
    family: varchar('family', { length: 20, enum: ['ferrite', 'powder', 'amorphous', 'nanocrystalline', 'other'] }).notNull(),
    unitSet: varchar('unit_set', { length: 20, enum: ['W/m3-Hz-T', 'mW/cm3-kHz-mT'] }).notNull(),
    kUploaded: doublePrecision('k_uploaded').notNull(),
    k: doublePrecision('k').notNull(),
    alpha: doublePrecision('alpha').notNull(),
    beta: doublePrecision('beta').notNull(),
    fitFrequencyMin: doublePrecision('fit_frequency_min').notNull(),
    fitFrequencyMax: doublePrecision('fit_frequency_max').notNull(),
    fitFluxMin: doublePrecision('fit_flux_min').notNull(),
    fitFluxMax: doublePrecision('fit_flux_max').notNull(),
    // Core-loss temperature behaviour F0 + c·(T − T0)² (all three or none): T0 °C, F0 > 0, c 1/K² ≥ 0.
    lowestLossTemperature: doublePrecision('lowest_loss_temperature'),
    lowestLossFactor: doublePrecision('lowest_loss_factor'),
    lossCurvature: doublePrecision('loss_curvature'),
    referenceTemperature: doublePrecision('reference_temperature'),
    // Highest tolerated hot-spot temperature (°C); null: the engine's default for the family.
    maxTemperature: doublePrecision('max_temperature'),
    bsat25: doublePrecision('bsat_25').notNull(),
    bsat100: doublePrecision('bsat_100').notNull(),
    permeability: doublePrecision('permeability').notNull(),
    // Powder roll-off μ/μi = 1/(1 + (H/H½)ⁿ) (both or none): H½ A/m, n.
    rollOffHalfField: doublePrecision('roll_off_half_field'),
    rollOffSteepness: doublePrecision('roll_off_steepness'),
    // Core loss under DC bias: factor 1 + (H/H₂)^m on the zero-bias loss (both or none): H₂ A/m, m.
    biasLossDoublingField: doublePrecision('bias_loss_doubling_field'),
    biasLossSteepness: doublePrecision('bias_loss_steepness'),
    density: doublePrecision('density').notNull(),
    provenance: text('provenance').notNull(),
    importId: integer('import_id').references((): AnyPgColumn => materialImports.id, { onDelete: 'set null' }),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('materials_lineage_version_idx').on(t.lineage, t.version),
    uniqueIndex('materials_current_name_idx')
      .on(sql`lower(${t.name})`)
      .where(sql`${t.current}`),
    check('materials_alpha_check', sql`${t.alpha} > 0 and ${t.alpha} < 4`),
    check('materials_beta_check', sql`${t.beta} > 0 and ${t.beta} < 5`),
    check('materials_k_check', sql`${t.k} > 0`),
    // Positive by construction: the loss factor F0 + c·(T − T0)² and the roll-off 1/(1 + (H/H½)ⁿ).
    check('materials_loss_factor_check', sql`${t.lowestLossFactor} > 0 and ${t.lossCurvature} >= 0`),
    check('materials_roll_off_check', sql`${t.rollOffHalfField} > 0 and ${t.rollOffSteepness} > 0`),
    check(
      'materials_bias_loss_check',
      sql`(${t.biasLossDoublingField} is null) = (${t.biasLossSteepness} is null) and ${t.biasLossDoublingField} > 0 and ${t.biasLossSteepness} > 0`,
    ),
  ],
);

/**
 * Measured or read-off core-loss points of one material version (SI units, temperature in °C), in file order.
 * They belong to that version: a new version made from them (an upload, an accepted fit, an edit) gets a copy,
 * so the points a fit came from stay beside it.
 */
export const materialLossPoints = pgTable(
  'material_loss_points',
  {
    id: serial('id').primaryKey(),
    materialId: integer('material_id')
      .notNull()
      .references(() => materials.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    frequency: doublePrecision('frequency').notNull(),
    peakFlux: doublePrecision('peak_flux').notNull(),
    temperature: doublePrecision('temperature').notNull(),
    lossDensity: doublePrecision('loss_density').notNull(),
    dcBias: doublePrecision('dc_bias'),
    source: varchar('source', { length: 200 }),
  },
  (t) => [
    uniqueIndex('material_loss_points_material_position_idx').on(t.materialId, t.position),
    check('material_loss_points_positive_check', sql`${t.frequency} > 0 and ${t.peakFlux} > 0 and ${t.lossDensity} > 0`),
  ],
);

/** One CSV upload of materials: who uploaded what and when, and what it did. */
export const materialImports = pgTable('material_imports', {
  id: serial('id').primaryKey(),
  fileName: varchar('file_name', { length: 200 }).notNull(),
  uploadedBy: integer('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
  uploadedAt: timestamp('uploaded_at', { withTimezone: true }).notNull().defaultNow(),
  rowCount: integer('row_count').notNull(),
  createdCount: integer('created_count').notNull(),
  versionedCount: integer('versioned_count').notNull(),
  skippedCount: integer('skipped_count').notNull(),
});

/**
 * Cores added by users, versioned like materials. `shape` holds the engine's CoreShape in SI units,
 * validated with the shared core schema before it is stored.
 */
export const userCores = pgTable(
  'user_cores',
  {
    id: serial('id').primaryKey(),
    lineage: varchar('lineage', { length: 80 }).notNull(),
    version: integer('version').notNull(),
    current: boolean('current').notNull().default(true),
    retired: boolean('retired').notNull().default(false),
    name: varchar('name', { length: 80 }).notNull(),
    family: varchar('family', { length: 20 }).notNull(),
    shape: jsonb('shape').$type<CoreShape>().notNull(),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('user_cores_lineage_version_idx').on(t.lineage, t.version),
    // As for materials: two current cores never share a name (the catalogue finds a core by its name).
    uniqueIndex('user_cores_current_name_idx')
      .on(sql`lower(${t.name})`)
      .where(sql`${t.current}`),
  ],
);

export const REVISION_STATUSES = ['draft', 'in_review', 'approved', 'released', 'superseded'] as const;

/** A design: a numbered inductor for one converter, owned by the engineer who created it. */
export const designs = pgTable('designs', {
  id: serial('id').primaryKey(),
  number: varchar('number', { length: 20 }).notNull().unique(),
  title: varchar('title', { length: 120 }).notNull(),
  ownerId: integer('owner_id')
    .notNull()
    .references(() => users.id),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A revision of a design: the spec, the chosen construction, and a snapshot of every computed figure
 * with the engine version that produced it. Only drafts change; later states are frozen.
 */
export const designRevisions = pgTable(
  'design_revisions',
  {
    id: serial('id').primaryKey(),
    designId: integer('design_id')
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    revision: integer('revision').notNull(),
    status: varchar('status', { length: 12, enum: REVISION_STATUSES }).notNull().default('draft'),
    spec: jsonb('spec').notNull(),
    construction: jsonb('construction'),
    result: jsonb('result'),
    engineVersion: varchar('engine_version', { length: 20 }),
    materialId: integer('material_id').references(() => materials.id),
    note: text('note'),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    approvedBy: integer('approved_by').references(() => users.id, { onDelete: 'set null' }),
    releasedAt: timestamp('released_at', { withTimezone: true }),
  },
  (t) => [
    uniqueIndex('design_revisions_design_revision_idx').on(t.designId, t.revision),
    check('design_revisions_status_check', sql`${t.status} in ('draft', 'in_review', 'approved', 'released', 'superseded')`),
  ],
);

/** Every state change of a revision (who, when, comment): the design's timeline. */
export const revisionTransitions = pgTable('revision_transitions', {
  id: serial('id').primaryKey(),
  revisionId: integer('revision_id')
    .notNull()
    .references(() => designRevisions.id, { onDelete: 'cascade' }),
  fromStatus: varchar('from_status', { length: 12 }),
  toStatus: varchar('to_status', { length: 12 }).notNull(),
  actorId: integer('actor_id').references(() => users.id, { onDelete: 'set null' }),
  comment: text('comment'),
  at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * Independent checks of a revision (circuit simulation now, field solution later), worked by check workers through
 * the job queue. The result is written together with 'done' in one transaction; at most one check of a kind is
 * queued or running per revision.
 */
export const revisionChecks = pgTable(
  'revision_checks',
  {
    id: serial('id').primaryKey(),
    revisionId: integer('revision_id')
      .notNull()
      .references(() => designRevisions.id, { onDelete: 'cascade' }),
    kind: varchar('kind', { length: 12, enum: ['circuit', 'field'] }).notNull(),
    status: varchar('status', { length: 12, enum: ['queued', 'running', 'done', 'failed', 'cancelled'] })
      .notNull()
      .default('queued'),
    progress: doublePrecision('progress').notNull().default(0),
    result: jsonb('result'),
    failure: text('failure'),
    /** The queue's id of the job, so a queued check can be taken off the queue when cancelled. */
    jobId: varchar('job_id', { length: 64 }),
    requestedBy: integer('requested_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [
    index('revision_checks_revision_idx').on(t.revisionId, t.kind, t.id),
    uniqueIndex('revision_checks_one_open_idx')
      .on(t.revisionId, t.kind)
      .where(sql`${t.status} in ('queued', 'running')`),
    check('revision_checks_kind_check', sql`${t.kind} in ('circuit', 'field')`),
    check('revision_checks_status_check', sql`${t.status} in ('queued', 'running', 'done', 'failed', 'cancelled')`),
    check('revision_checks_progress_check', sql`${t.progress} >= 0 and ${t.progress} <= 1`),
  ],
);

/** A released revision handed to the winding shop: the sheet is frozen at release and never recomputed. */
export const buildOrders = pgTable('build_orders', {
  id: serial('id').primaryKey(),
  number: varchar('number', { length: 20 }).notNull().unique(),
  revisionId: integer('revision_id')
    .notNull()
    .unique()
    .references(() => designRevisions.id),
  quantity: integer('quantity').notNull(),
  status: varchar('status', { length: 12, enum: ['open', 'complete'] })
    .notNull()
    .default('open'),
  sheet: jsonb('sheet').notNull(),
  createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  completedAt: timestamp('completed_at', { withTimezone: true }),
});

/** One unit built and tested against the sheet's limits. */
export const buildUnits = pgTable(
  'build_units',
  {
    id: serial('id').primaryKey(),
    orderId: integer('order_id')
      .notNull()
      .references(() => buildOrders.id, { onDelete: 'cascade' }),
    unitNumber: integer('unit_number').notNull(),
    inductance: doublePrecision('inductance').notNull(),
    testFrequency: doublePrecision('test_frequency').notNull(),
    resistance: doublePrecision('resistance').notNull(),
    resistanceTemperature: doublePrecision('resistance_temperature').notNull(),
    resistanceAt20: doublePrecision('resistance_at_20').notNull(),
    /** Inductance under DC bias (H) at the current given (A), where measured. */
    biasCurrent: doublePrecision('bias_current'),
    biasInductance: doublePrecision('bias_inductance'),
    hipot: varchar('hipot', { length: 12, enum: ['pass', 'fail', 'not_tested'] }).notNull(),
    passed: boolean('passed').notNull(),
    findings: jsonb('findings').notNull(),
    notes: text('notes'),
    recordedBy: integer('recorded_by').references(() => users.id, { onDelete: 'set null' }),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
    /** A wrong record is voided with a reason, never deleted; its unit number can then be recorded again. */
    voidedAt: timestamp('voided_at', { withTimezone: true }),
    voidedBy: integer('voided_by').references(() => users.id, { onDelete: 'set null' }),
    voidReason: text('void_reason'),
  },
  (t) => [
    uniqueIndex('build_units_order_unit_idx')
      .on(t.orderId, t.unitNumber)
      .where(sql`${t.voidedAt} is null`),
  ],
);

/** E-mails the app sends (the release hand-off), with their delivery state and retries. */
export const mailDeliveries = pgTable('mail_deliveries', {
  id: serial('id').primaryKey(),
  orderId: integer('order_id').references(() => buildOrders.id, { onDelete: 'cascade' }),
  recipient: varchar('recipient', { length: 200 }).notNull(),
  subject: varchar('subject', { length: 200 }).notNull(),
  status: varchar('status', { length: 10, enum: ['pending', 'sent', 'failed'] })
    .notNull()
    .default('pending'),
  attempts: integer('attempts').notNull().default(0),
  lastError: text('last_error'),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  sentAt: timestamp('sent_at', { withTimezone: true }),
});

/** Messages received by the built-in fake SMTP server (development and tests), shown in the admin outbox. */
export const capturedMail = pgTable('captured_mail', {
  id: serial('id').primaryKey(),
  envelopeFrom: varchar('envelope_from', { length: 200 }),
  envelopeTo: text('envelope_to').notNull(),
  raw: text('raw').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});

import { sql } from 'drizzle-orm';
import { blob, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';

/*
 * Measured physical quantities are REAL in the canonical units of lib/measure (g, Wh, W, lm, cd, lx, m, s, °C,
 * V, A, Ah), unrounded. Money is an integer in minor units with an ISO 4217 code.
 */

const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`);

export const ROLES = ['reader', 'reviewer', 'editor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** Gear items and field tests move through these states (reviews have their own, see reviewRevisions). */
export const RECORD_STATES = ['draft', 'in-review', 'changes-requested', 'approved'] as const;
export type RecordState = (typeof RECORD_STATES)[number];

export const REVIEW_STATES = ['draft', 'in-review', 'changes-requested', 'approved', 'published', 'retracted'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

export const users = sqliteTable(
  'users',
  {
    id: text('id').primaryKey(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    passwordHash: text('password_hash'),
    role: text('role', { enum: ROLES }).notNull().default('reader'),
    /** Bumped on sign-out, role change and disabling: every session carrying an older version ends. */
    sessionVersion: integer('session_version').notNull().default(1),
    disabledAt: integer('disabled_at', { mode: 'timestamp_ms' }),
    isDemo: integer('is_demo', { mode: 'boolean' }).notNull().default(false),
    unitPreference: text('unit_preference', { enum: ['metric', 'imperial'] }).notNull().default('metric'),
    emailVerifiedAt: integer('email_verified_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email)],
);

/** Magic sign-in links: only a hash of the token is stored; spent on the confirm button, never on GET. */
export const magicLinkTokens = sqliteTable(
  'magic_link_tokens',
  {
    tokenHash: text('token_hash').primaryKey(),
    email: text('email').notNull(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    usedAt: integer('used_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [index('magic_link_tokens_email').on(t.email)],
);

/** Security-relevant events: failed sign-ins, rate limiting, role changes, disabling. */
export const authEvents = sqliteTable(
  'auth_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind').notNull(),
    email: text('email'),
    userId: text('user_id').references(() => users.id, { onDelete: 'set null' }),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    detail: text('detail'),
    createdAt: createdAt(),
  },
  (t) => [index('auth_events_kind').on(t.kind, t.createdAt)],
);

export const roleChanges = sqliteTable('role_changes', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  userId: text('user_id')
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  changedById: text('changed_by_id').references(() => users.id, { onDelete: 'set null' }),
  fromRole: text('from_role', { enum: ROLES }).notNull(),
  toRole: text('to_role', { enum: ROLES }).notNull(),
  createdAt: createdAt(),
});

export const gearItems = sqliteTable(
  'gear_items',
  {
    id: text('id').primaryKey(),
    slug: text('slug').notNull(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id),
    name: text('name').notNull(),
    maker: text('maker').notNull(),
    /** Category id of lib/measure: light, power-bank, battery-12v, solar-panel, radio, cable-adapter, other. */
    category: text('category').notNull(),
    kind: text('kind'),
    modelYear: integer('model_year'),
    priceMinor: integer('price_minor'),
    priceCurrency: text('price_currency'),
    pricePaidOn: text('price_paid_on'),
    notes: text('notes').notNull().default(''),
    /** Cell chemistry (lib/measure CHEMISTRIES) for items that store energy; decides whether airline bands apply. */
    chemistry: text('chemistry'),
    /** IEC 60529 IP code such as IPX4 or IP67. */
    waterRating: text('water_rating'),
    /**
     * Other categories the item also serves as (JSON list of category ids, never its primary one): a
     * lantern with a USB output that also serves as a power bank. Approved value once the item is public.
     */
    alsoServesAs: text('also_serves_as', { mode: 'json' })
      .notNull()
      .$type<string[]>()
      .default(sql`'[]'`),
    /**
     * State of the item's latest version. `approvedAt` set means an approved version is public: the
     * columns here and the `specs` rows are then the approved figures, and an author's later edits wait
     * in `gear_pending_changes` until approved (see db/gear.ts).
     */
    status: text('status', { enum: RECORD_STATES }).notNull().default('draft'),
    approvedAt: integer('approved_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [
    uniqueIndex('gear_items_slug_unique').on(t.slug),
    index('gear_items_category').on(t.category, t.status),
    index('gear_items_owner').on(t.ownerId),
  ],
);

export const fieldTests = sqliteTable(
  'field_tests',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id),
    kind: text('kind').notNull(),
    testedAt: integer('tested_at', { mode: 'timestamp_ms' }).notNull(),
    placeLabel: text('place_label').notNull().default(''),
    sky: text('sky', { enum: ['clear', 'thin-cloud', 'broken-cloud', 'overcast', 'rain', 'indoor'] }),
    ambientC: real('ambient_c'),
    /** JSON array of { name, accuracy } describing the instruments used. */
    instruments: text('instruments', { mode: 'json' }).$type<{ name: string; accuracy?: string }[]>().notNull().default(sql`'[]'`),
    methodNotes: text('method_notes').notNull().default(''),
    status: text('status', { enum: RECORD_STATES }).notNull().default('draft'),
    approvedAt: integer('approved_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    /** Last change to the record or its trials (null: never changed since created). */
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('field_tests_owner').on(t.ownerId), index('field_tests_status').on(t.status, t.kind)],
);

export const fieldTestItems = sqliteTable(
  'field_test_items',
  {
    fieldTestId: text('field_test_id')
      .notNull()
      .references(() => fieldTests.id, { onDelete: 'cascade' }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.fieldTestId, t.gearItemId] })],
);

export const trials = sqliteTable(
  'trials',
  {
    id: text('id').primaryKey(),
    fieldTestId: text('field_test_id')
      .notNull()
      .references(() => fieldTests.id, { onDelete: 'cascade' }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    label: text('label').notNull().default(''),
    /** Clock time the item was switched on; t = 0 for logs with clock timestamps. */
    switchedOnAt: integer('switched_on_at', { mode: 'timestamp_ms' }),
    /** Typed values such as a scale reading: { specKey: value } in canonical units. */
    typedValues: text('typed_values', { mode: 'json' }).$type<Record<string, number>>(),
    /** Order of the trial within its test. */
    position: integer('position').notNull().default(0),
    /**
     * The readings series, every row, encoded compactly and exactly by lib/readings `encodeSeries`
     * (format in `seriesFormat`, "TBS1"); t in seconds since switch-on. Null when the trial has typed values only.
     */
    series: blob('series', { mode: 'buffer' }),
    seriesFormat: text('series_format'),
    /** Number of samples in `series`. */
    seriesLength: integer('series_length'),
    /** Where the series came from and what the parser did (file name, time unit, rows read and left out …). */
    seriesMeta: text('series_meta', { mode: 'json' }).$type<TrialSeriesMeta>(),
    /** Plain sentences shown beside the chart, e.g. "12 rows before switch-on dropped". */
    seriesNotes: text('series_notes', { mode: 'json' }).$type<string[]>().notNull().default(sql`'[]'`),
    createdAt: createdAt(),
  },
  (t) => [index('trials_field_test').on(t.fieldTestId)],
);

export interface TrialSeriesMeta {
  /** An uploaded logger file, typed-in readings, or a series generated by the demo seed. */
  source: 'csv' | 'typed' | 'generated';
  fileName?: string;
  fileBytes?: number;
  timeUnit: string;
  fields: string[];
  dataRows: number;
  droppedBeforeSwitchOn: number;
  droppedRows: number;
  durationS: number;
}

/** Review state changes of field tests (lib/workflow `record` kind), with the editor's comment when sent back. */
export const fieldTestStateEvents = sqliteTable(
  'field_test_state_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    fieldTestId: text('field_test_id')
      .notNull()
      .references(() => fieldTests.id, { onDelete: 'cascade' }),
    fromState: text('from_state', { enum: RECORD_STATES }),
    toState: text('to_state', { enum: RECORD_STATES }).notNull(),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    comment: text('comment').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('field_test_state_events_test').on(t.fieldTestId, t.createdAt)],
);

/**
 * Legacy: one row per sample of a trial's readings series; t in seconds since switch-on. Field tests now
 * store the series on `trials.series`; kept while db/kits.ts still reads it (db/field-tests.ts `trialSamples` reads both).
 */
export const readings = sqliteTable(
  'readings',
  {
    trialId: text('trial_id')
      .notNull()
      .references(() => trials.id, { onDelete: 'cascade' }),
    seq: integer('seq').notNull(),
    t: real('t').notNull(),
    value: real('value'),
    watts: real('watts'),
    volts: real('volts'),
    amps: real('amps'),
  },
  (t) => [primaryKey({ columns: [t.trialId, t.seq] })],
);

export const specs = sqliteTable(
  'specs',
  {
    id: text('id').primaryKey(),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    /** SpecKey of lib/measure; the unit is implied by the key (canonical). */
    key: text('key').notNull(),
    /** Light or device mode the figure belongs to ('' for the item as a whole). */
    mode: text('mode').notNull().default(''),
    basis: text('basis', { enum: ['claimed', 'measured'] }).notNull(),
    value: real('value').notNull(),
    sd: real('sd'),
    n: integer('n'),
    /** Where a claim came from: packaging, manual, makers-site. */
    claimSource: text('claim_source'),
    fieldTestId: text('field_test_id').references(() => fieldTests.id, { onDelete: 'set null' }),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [uniqueIndex('specs_item_key_mode_basis').on(t.gearItemId, t.key, t.mode, t.basis)],
);

export const reviews = sqliteTable(
  'reviews',
  {
    id: text('id').primaryKey(),
    slug: text('slug').notNull(),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('reviews_slug_unique').on(t.slug)],
);

export const reviewItems = sqliteTable(
  'review_items',
  {
    reviewId: text('review_id')
      .notNull()
      .references(() => reviews.id, { onDelete: 'cascade' }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.reviewId, t.gearItemId] })],
);

export const DISCLOSURES = ['bought-retail', 'loaned-by-maker', 'given-by-maker', 'sponsored'] as const;

export const reviewRevisions = sqliteTable(
  'review_revisions',
  {
    id: text('id').primaryKey(),
    reviewId: text('review_id')
      .notNull()
      .references(() => reviews.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    title: text('title').notNull(),
    summary: text('summary').notNull().default(''),
    verdict: text('verdict').notNull().default(''),
    body: text('body').notNull().default(''),
    disclosure: text('disclosure', { enum: DISCLOSURES }),
    disclosureNote: text('disclosure_note').notNull().default(''),
    correctionNote: text('correction_note'),
    state: text('state', { enum: REVIEW_STATES }).notNull().default('draft'),
    publishedAt: integer('published_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [uniqueIndex('review_revisions_number').on(t.reviewId, t.number)],
);

export const reviewStateEvents = sqliteTable(
  'review_state_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: text('revision_id')
      .notNull()
      .references(() => reviewRevisions.id, { onDelete: 'cascade' }),
    fromState: text('from_state', { enum: REVIEW_STATES }),
    toState: text('to_state', { enum: REVIEW_STATES }).notNull(),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    comment: text('comment').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('review_state_events_revision').on(t.revisionId)],
);

export const photos = sqliteTable(
  'photos',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id),
    gearItemId: text('gear_item_id').references(() => gearItems.id, { onDelete: 'cascade' }),
    /** Content-hashed base name of the stored variants under uploads/. */
    storageKey: text('storage_key').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    altText: text('alt_text').notNull().default(''),
    position: integer('position').notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [index('photos_item').on(t.gearItemId)],
);

export const kits = sqliteTable(
  'kits',
  {
    id: text('id').primaryKey(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    purpose: text('purpose').notNull().default(''),
    tripDays: integer('trip_days').notNull().default(1),
    shareToken: text('share_token'),
    /* Power budget: charging and conversion (null = the lib/measure default). */
    /** Clear-sky peak sun hours for the trip's place and season, h/day (0–24); needed when the kit has panels. */
    peakSunHours: real('peak_sun_hours'),
    /** Expected sky for the trip (a field-test sky value) that the sky share was chosen for. */
    sky: text('sky', { enum: ['clear', 'thin-cloud', 'broken-cloud', 'overcast', 'rain'] }),
    /** Output under the expected sky ÷ the same panel's clear-sky output, 0–1. */
    skyShare: real('sky_share'),
    /** PV system losses as a fraction, 0 ≤ l < 1. */
    lossFraction: real('loss_fraction'),
    /** Efficiency from storage to the loads (converters, chargers, cables), (0, 1]. */
    conversionEfficiency: real('conversion_efficiency'),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [uniqueIndex('kits_share_token').on(t.shareToken), index('kits_owner').on(t.ownerId)],
);

export const kitEntries = sqliteTable(
  'kit_entries',
  {
    id: text('id').primaryKey(),
    kitId: text('kit_id')
      .notNull()
      .references(() => kits.id, { onDelete: 'cascade' }),
    gearItemId: text('gear_item_id').references(() => gearItems.id, { onDelete: 'set null' }),
    quantity: integer('quantity').notNull().default(1),
    /** Free-form entries for things not in the catalog. */
    freeName: text('free_name'),
    freeMassG: real('free_mass_g'),
    freePriceMinor: integer('free_price_minor'),
    freePriceCurrency: text('free_price_currency'),
    freeDrawW: real('free_draw_w'),
    /* Power budget settings of the entry (null = default). */
    /** Load: the powerDraw mode used (a spec mode of the item, e.g. 'high', 'transmit'). */
    loadMode: text('load_mode'),
    /** Load: hours a day the device is on, 0–24. */
    hoursPerDay: real('hours_per_day'),
    /** Load: share of the on-time spent drawing the chosen mode's power, (0, 1]. */
    dutyCycle: real('duty_cycle'),
    /** Storage: cell chemistry (lib/measure CHEMISTRIES) when the item does not state one, or to correct it. */
    chemistry: text('chemistry'),
    /** Storage: allowed depth of discharge, (0, 1]; null = the chemistry's default. */
    depthOfDischarge: real('depth_of_discharge'),
    /** Free-form entries: role in charging paths (lib/kits FREE_ROLES: device, storage, source, cable, adapter). */
    freeRole: text('free_role'),
    /** Free-form entries: ports (lib/measure Port[]), checked by lib/kits portSchema on the way in and out. */
    freePorts: text('free_ports', { mode: 'json' }).$type<unknown>(),
    /** Free-form cable or adapter: conversion efficiency, (0, 1]. */
    freeEfficiency: real('free_efficiency'),
    /** Free-form storage: rated (stored) energy of one unit, Wh; counted in the budget like a catalog item's ratedEnergy. */
    freeEnergyWh: real('free_energy_wh'),
    /** Free-form source (solar panel): rated power of one unit, W; counted in the budget like a catalog item's ratedPower. */
    freeRatedW: real('free_rated_w'),
    position: integer('position').notNull().default(0),
  },
  (t) => [index('kit_entries_kit').on(t.kitId)],
);

/** Every message the app sends while no SMTP_URL is set, captured by the local SMTP server: the admin outbox. */
export const capturedEmails = sqliteTable('captured_emails', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  fromAddress: text('from_address').notNull(),
  toAddress: text('to_address').notNull(),
  subject: text('subject').notNull(),
  textBody: text('text_body').notNull().default(''),
  htmlBody: text('html_body'),
  createdAt: createdAt(),
});

/**
 * An approved item's edits waiting for approval: the whole editable state (fields and claimed specs,
 * canonical units) as JSON. One row per item at most; applied to gear_items/specs in the approval
 * transaction and then deleted. The item's `status` says where the change is (draft, in review …).
 */
export const gearPendingChanges = sqliteTable('gear_pending_changes', {
  gearItemId: text('gear_item_id')
    .primaryKey()
    .references(() => gearItems.id, { onDelete: 'cascade' }),
  data: text('data', { mode: 'json' }).notNull().$type<GearPendingData>(),
  authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
  createdAt: createdAt(),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`),
});

export interface GearPendingData {
  name: string;
  maker: string;
  kind: string | null;
  modelYear: number | null;
  priceMinor: number | null;
  priceCurrency: string | null;
  pricePaidOn: string | null;
  notes: string;
  chemistry: string | null;
  waterRating: string | null;
  changeNote: string;
  claims: { key: string; mode: string; value: number; source: string }[];
  /** Claimed ports (lib/measure `Port` plus its claim source); absent in changes saved before ports existed. */
  ports?: GearPortClaim[];
  /** Other categories the item also serves as; absent in changes saved before roles existed. */
  alsoServesAs?: string[];
  /** Feature checklist answers (lib/gear/features.ts); absent in changes saved before features existed. */
  features?: GearFeatureClaim[];
}

/** One feature checklist answer: the item has it (with an optional detail such as a hook's material) or has not. */
export interface GearFeatureClaim {
  name: string;
  present: boolean;
  detail?: string;
}

/** A claimed port as stored in a pending change and returned by the working copy. */
export interface GearPortClaim {
  kind: string;
  direction: 'input' | 'output' | 'both';
  volts?: number;
  amps?: number;
  watts?: number;
  pdProfiles?: { volts: number; amps: number }[];
  voltageWindow?: { minVolts: number; maxVolts: number };
  label?: string;
  efficiency?: number;
  source: string;
}

/**
 * Feature checklist answers of a gear item (names from lib/gear/features.ts). A row says the item has
 * (`present` 1) or has not (0) the feature; no row means "not stated". Follows the item's workflow like
 * claimed ports: once the item is approved these rows are the approved answers and an edit waits in
 * `gear_pending_changes.data.features`.
 */
export const gearFeatures = sqliteTable(
  'gear_features',
  {
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    present: integer('present', { mode: 'boolean' }).notNull(),
    /** Short text for features that take one, e.g. a hanging hook's material. */
    detail: text('detail'),
  },
  (t) => [primaryKey({ columns: [t.gearItemId, t.name] }), index('gear_features_name').on(t.name, t.present)],
);

/** Every change to a spec: who, when, old → new. `context`: a draft edit, an edit pending approval, or applied by approval. */
export const specChanges = sqliteTable(
  'spec_changes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    mode: text('mode').notNull().default(''),
    basis: text('basis', { enum: ['claimed', 'measured'] }).notNull(),
    oldValue: real('old_value'),
    newValue: real('new_value'),
    oldSource: text('old_source'),
    newSource: text('new_source'),
    context: text('context', { enum: ['edit', 'pending', 'approval'] }).notNull(),
    /** Changes that are not one number (a port): the old and new state in words, e.g. "USB-C output, 5 V 3 A · 9 V 3 A". */
    oldText: text('old_text'),
    newText: text('new_text'),
    changedById: text('changed_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('spec_changes_item').on(t.gearItemId, t.createdAt)],
);

/**
 * Ports of a gear item (lib/measure `Port`, figures in V, A, W), in the order the author listed them.
 * Claimed ports follow the item's workflow like claimed specs: once the item is approved these rows are
 * the approved (public) ports and an edit waits in `gear_pending_changes.data.ports`. `basis` 'measured'
 * (with its field test) is reserved for ports measured by a field test.
 */
export const gearPorts = sqliteTable(
  'gear_ports',
  {
    id: text('id').primaryKey(),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    basis: text('basis', { enum: ['claimed', 'measured'] }).notNull().default('claimed'),
    /** lib/measure PORT_KINDS: usb-a, usb-c, socket-12v, dc-barrel, binding-posts, genderless-dc, mains-input, solar-input, other. */
    kind: text('kind').notNull(),
    direction: text('direction', { enum: ['input', 'output', 'both'] }).notNull(),
    volts: real('volts'),
    amps: real('amps'),
    watts: real('watts'),
    /** USB-C only: USB Power Delivery fixed profiles [{ volts, amps }]. */
    pdProfiles: text('pd_profiles', { mode: 'json' }).$type<{ volts: number; amps: number }[]>(),
    /** Inputs only: accepted voltage window, V. */
    minVolts: real('min_volts'),
    maxVolts: real('max_volts'),
    label: text('label'),
    /** Conversion efficiency inside the item at this port, (0, 1]. */
    efficiency: real('efficiency'),
    /** Where a claim came from: packaging, manual, makers-site. */
    claimSource: text('claim_source'),
    fieldTestId: text('field_test_id').references(() => fieldTests.id, { onDelete: 'set null' }),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [
    uniqueIndex('gear_ports_item_basis_position').on(t.gearItemId, t.basis, t.position),
    index('gear_ports_kind_direction').on(t.kind, t.direction),
  ],
);

/** Value ratios of approved figures (lib/measure valueRatios), recomputed in the approval transaction; browse sorts on these. */
export const gearRatios = sqliteTable(
  'gear_ratios',
  {
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    ratioId: text('ratio_id').notNull(),
    value: real('value').notNull(),
    unit: text('unit').notNull(),
    basis: text('basis', { enum: ['measured', 'claimed', 'mixed'] }).notNull(),
    /** ISO 4217 code for per-money ratios, else null. */
    currency: text('currency'),
    higherIsBetter: integer('higher_is_better', { mode: 'boolean' }),
    computedAt: integer('computed_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.gearItemId, t.ratioId] }), index('gear_ratios_ratio_value').on(t.ratioId, t.value)],
);

/** Review state changes of gear items, with the editor's comment when sent back. */
export const gearStateEvents = sqliteTable(
  'gear_state_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    fromState: text('from_state', { enum: RECORD_STATES }),
    toState: text('to_state', { enum: RECORD_STATES }).notNull(),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    comment: text('comment').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('gear_state_events_item').on(t.gearItemId, t.createdAt)],
);

/** Dated "figures updated" notes: one per approval that changed an already public item's figures. */
export const gearFigureNotes = sqliteTable(
  'gear_figure_notes',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    note: text('note').notNull().default(''),
    /** Generated list of what changed, e.g. "Mass (claimed): 410 g → 400 g". */
    summary: text('summary').notNull(),
    approvedById: text('approved_by_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('gear_figure_notes_item').on(t.gearItemId, t.createdAt)],
);

export type User = typeof users.$inferSelect;
export type GearItem = typeof gearItems.$inferSelect;
export type FieldTest = typeof fieldTests.$inferSelect;
export type Trial = typeof trials.$inferSelect;

/**
 * Per-user switches for review workflow mail (issue 6, "Notifications"). No row means every switch is
 * on. Editors use `reviewSubmitted`; authors the other four.
 */
export const notificationSettings = sqliteTable('notification_settings', {
  userId: text('user_id')
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  reviewSubmitted: integer('review_submitted', { mode: 'boolean' }).notNull().default(true),
  changesRequested: integer('changes_requested', { mode: 'boolean' }).notNull().default(true),
  approved: integer('approved', { mode: 'boolean' }).notNull().default(true),
  published: integer('published', { mode: 'boolean' }).notNull().default(true),
  retracted: integer('retracted', { mode: 'boolean' }).notNull().default(true),
  updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
    .notNull()
    .default(sql`(unixepoch('subsec') * 1000)`),
});

export const API_TOKEN_SCOPES = ['read', 'write'] as const;
export type ApiTokenScope = (typeof API_TOKEN_SCOPES)[number];

/**
 * Personal API tokens (issue 7). Only a SHA-256 hash of the secret is stored; `prefix` is a short,
 * non-secret beginning of the token shown in the account page so its owner can tell tokens apart.
 * A token acts as its owner's current role, re-read on every request.
 */
export const apiTokens = sqliteTable(
  'api_tokens',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    scope: text('scope', { enum: API_TOKEN_SCOPES }).notNull(),
    tokenHash: text('token_hash').notNull(),
    prefix: text('prefix').notNull(),
    createdAt: createdAt(),
    lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  },
  (t) => [uniqueIndex('api_tokens_token_hash').on(t.tokenHash), index('api_tokens_user').on(t.userId)],
);

export type ApiToken = typeof apiTokens.$inferSelect;

/**
 * "Where to buy" links of a review revision (issue 6, reader trust). They belong to the revision so a
 * published revision's links never change: a correction copies them into its new draft, where the author
 * may edit them, and they go public again only through the same review. URLs are https only (lib/reviews/buy-links.ts).
 */
export const reviewBuyLinks = sqliteTable(
  'review_buy_links',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    revisionId: text('revision_id')
      .notNull()
      .references(() => reviewRevisions.id, { onDelete: 'cascade' }),
    position: integer('position').notNull().default(0),
    label: text('label').notNull(),
    url: text('url').notNull(),
    isAffiliate: integer('is_affiliate', { mode: 'boolean' }).notNull().default(false),
  },
  (t) => [index('review_buy_links_revision').on(t.revisionId, t.position)],
);

/** What a long-term note is about (issue 9): our own list; labels and hints in lib/long-term-notes/kinds.ts. */
export const LONG_TERM_NOTE_KINDS = ['use', 'wear', 'failure', 'repair', 'retired'] as const;
export type LongTermNoteKind = (typeof LONG_TERM_NOTE_KINDS)[number];

/**
 * Long-term notes (issue 9): a reviewer's dated note on an item they own or tested — months in service,
 * what wore, failed or was repaired. The `record` workflow; approved (and the item public) means public.
 * `body` is Markdown, rendered through lib/markdown (sanitized) when shown.
 */
export const longTermNotes = sqliteTable(
  'long_term_notes',
  {
    id: text('id').primaryKey(),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    /** Calendar date of what the note reports, YYYY-MM-DD (a day, no time zone). */
    notedOn: text('noted_on').notNull(),
    monthsInService: integer('months_in_service').notNull(),
    kind: text('kind', { enum: LONG_TERM_NOTE_KINDS }).notNull(),
    title: text('title').notNull(),
    body: text('body').notNull(),
    status: text('status', { enum: RECORD_STATES }).notNull().default('draft'),
    approvedAt: integer('approved_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .default(sql`(unixepoch('subsec') * 1000)`),
  },
  (t) => [
    index('long_term_notes_item').on(t.gearItemId, t.status, t.notedOn),
    index('long_term_notes_author').on(t.authorId),
    index('long_term_notes_status').on(t.status),
  ],
);

/** Review state changes of long-term notes, with the editor's comment when sent back. */
export const longTermNoteStateEvents = sqliteTable(
  'long_term_note_state_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    noteId: text('note_id')
      .notNull()
      .references(() => longTermNotes.id, { onDelete: 'cascade' }),
    fromState: text('from_state', { enum: RECORD_STATES }),
    toState: text('to_state', { enum: RECORD_STATES }).notNull(),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    comment: text('comment').notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [index('long_term_note_state_events_note').on(t.noteId, t.createdAt)],
);

export type LongTermNote = typeof longTermNotes.$inferSelect;

/**
 * Radio-noise check readings (issue 9): per band, a receiver's noise floor on a quiet reference supply
 * (baseline) and with the item under test, each as entered (S-units + dB over S9, or dBm) and in dBm
 * (IARU Region 1 Rec. R.1 via lib/measure `sMeterToDbm`). The S-meter range follows from the frequency
 * (≤ 30 MHz below, else above: lib/field-tests/radio-noise.ts `rangeOfFrequency`). Written only by db/radio-noise.ts.
 */
export const radioNoiseReadings = sqliteTable(
  'radio_noise_readings',
  {
    id: text('id').primaryKey(),
    fieldTestId: text('field_test_id')
      .notNull()
      .references(() => fieldTests.id, { onDelete: 'cascade' }),
    gearItemId: text('gear_item_id')
      .notNull()
      .references(() => gearItems.id, { onDelete: 'cascade' }),
    position: integer('position').notNull(),
    /** Band label as the reviewer names it: "40 m", "2 m". */
    band: text('band').notNull(),
    frequencyMhz: real('frequency_mhz').notNull(),
    range: text('range', { enum: ['below-30mhz', 'above-30mhz'] }).notNull(),
    /** lib/field-tests/radio-noise.ts RADIO_MODES. */
    mode: text('mode', { enum: ['ssb', 'cw', 'am', 'fm', 'data'] }).notNull(),
    bandwidthHz: real('bandwidth_hz').notNull(),
    antenna: text('antenna').notNull().default(''),
    distanceM: real('distance_m').notNull(),
    baselineScale: text('baseline_scale', { enum: ['s-meter', 'dbm'] }).notNull(),
    baselineSUnits: real('baseline_s_units'),
    baselineDbOverS9: real('baseline_db_over_s9'),
    baselineDbm: real('baseline_dbm').notNull(),
    withItemScale: text('with_item_scale', { enum: ['s-meter', 'dbm'] }).notNull(),
    withItemSUnits: real('with_item_s_units'),
    withItemDbOverS9: real('with_item_db_over_s9'),
    withItemDbm: real('with_item_dbm').notNull(),
  },
  (t) => [index('radio_noise_readings_test').on(t.fieldTestId, t.position), index('radio_noise_readings_item').on(t.gearItemId)],
);

export type RadioNoiseReading = typeof radioNoiseReadings.$inferSelect;

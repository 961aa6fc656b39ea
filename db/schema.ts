import { relations, sql } from "drizzle-orm";
import type { SoundTable } from "../lib/hardware/types";
import {
  bigint,
  bigserial,
  boolean,
  check,
  customType,
  date,
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
} from "drizzle-orm/pg-core";
// The enums take their values from the one list each in lib/, so the database, the API and the screens agree.
import { ROLES } from "../lib/auth/roles";
import { STAGE_ORDER } from "../lib/release/stages";

const bytea = customType<{ data: Uint8Array; driverData: Buffer }>({
  dataType: () => "bytea",
  toDriver: (v) => Buffer.from(v),
  fromDriver: (v) => new Uint8Array(v),
});

const timestamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
};

export const roleEnum = pgEnum("role", ROLES);

// ---------------------------------------------------------------- people and access

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: roleEnum("role").notNull().default("viewer"),
    passwordHash: text("password_hash").notNull(),
    disabledAt: timestamp("disabled_at", { withTimezone: true }),
    // Bumped when a user is disabled: sessions signed with an older epoch stop working.
    sessionEpoch: integer("session_epoch").notNull().default(0),
    ...timestamps,
  },
  (t) => [uniqueIndex("users_email_key").on(sql`lower(${t.email})`)],
);

export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull(),
    tokenPrefix: text("token_prefix").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("api_tokens_hash_key").on(t.tokenHash), index("api_tokens_user_idx").on(t.userId)],
);

/**
 * Browser sessions as the server knows them: the session cookie names one row, and a session
 * whose row is revoked (sign-out, password change) or expired is refused at its next request.
 */
export const userSessions = pgTable(
  "user_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("user_sessions_user_idx").on(t.userId)],
);

/** Failed sign-ins per account key and per client address; kept in PostgreSQL so any instance sees them. */
export const signInAttempts = pgTable("sign_in_attempts", {
  key: text("key").primaryKey(),
  failures: integer("failures").notNull().default(0),
  windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull().defaultNow(),
  lockedUntil: timestamp("locked_until", { withTimezone: true }),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    actorUserId: uuid("actor_user_id").references(() => users.id, { onDelete: "set null" }),
    actorLabel: text("actor_label").notNull(),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
    requestId: text("request_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("audit_events_entity_idx").on(t.entityType, t.entityId),
    index("audit_events_actor_idx").on(t.actorUserId),
    index("audit_events_created_idx").on(t.createdAt),
  ],
);

// ---------------------------------------------------------------- hardware registry

export const componentKindEnum = pgEnum("component_kind", ["fan", "pump"]);

export const components = pgTable(
  "components",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: componentKindEnum("kind").notNull(),
    name: text("name").notNull(),
    minDutyPct: doublePrecision("min_duty_pct").notNull(),
    rpmAtMinDuty: integer("rpm_at_min_duty").notNull(),
    maxRpm: integer("max_rpm").notNull(),
    tachPulsesPerRev: integer("tach_pulses_per_rev").notNull().default(2),
    refSoundDbA: doublePrecision("ref_sound_dba").notNull(),
    refRpm: integer("ref_rpm").notNull(),
    soundExponent: doublePrecision("sound_exponent").notNull().default(50),
    /** Measured RPM → dB(A) table at a stated distance; null: the reference level and exponent are used. */
    soundTable: jsonb("sound_table").$type<SoundTable>(),
    /** True: stops at 0 % duty; false: keeps its minimum speed below the minimum duty (4-wire PWM fan spec rev. 1.3 §3.4). */
    stopsAtZeroDuty: boolean("stops_at_zero_duty").notNull().default(false),
    flowAtMaxRpmLpm: doublePrecision("flow_at_max_rpm_lpm"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("components_name_key").on(t.name),
    check("components_min_duty_range", sql`${t.minDutyPct} >= 0 and ${t.minDutyPct} <= 100`),
    check("components_rpm_order", sql`${t.rpmAtMinDuty} > 0 and ${t.maxRpm} > ${t.rpmAtMinDuty}`),
    check("components_tach_pulses", sql`${t.tachPulsesPerRev} between 1 and 12`),
    check(
      "components_sound_table_shape",
      sql`${t.soundTable} is null or (jsonb_typeof(${t.soundTable}->'distanceM') = 'number' and jsonb_typeof(${t.soundTable}->'points') = 'array' and jsonb_array_length(${t.soundTable}->'points') between 2 and 64)`,
    ),
  ],
);

export const boardModels = pgTable(
  "board_models",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    serialPrefix: text("serial_prefix").notNull(),
    description: text("description").notNull().default(""),
    ...timestamps,
  },
  (t) => [uniqueIndex("board_models_name_key").on(t.name), uniqueIndex("board_models_serial_prefix_key").on(t.serialPrefix)],
);

export const boardRevisions = pgTable(
  "board_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    boardModelId: uuid("board_model_id").notNull().references(() => boardModels.id),
    revision: text("revision").notNull(),
    memoryBytes: integer("memory_bytes").notNull(),
    baseAddress: bigint("base_address", { mode: "number" }).notNull(),
    slotCount: integer("slot_count").notNull(),
    maxPointsPerCurve: integer("max_points_per_curve").notNull(),
    pwmFrequencyHz: integer("pwm_frequency_hz").notNull().default(25000),
    tachPulsesPerRev: integer("tach_pulses_per_rev").notNull().default(2),
    notes: text("notes").notNull().default(""),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("board_revisions_model_revision_key").on(t.boardModelId, t.revision),
    index("board_revisions_model_idx").on(t.boardModelId),
    check("board_revisions_memory_positive", sql`${t.memoryBytes} > 0`),
    check("board_revisions_slots_positive", sql`${t.slotCount} between 1 and 16`),
  ],
);

export const coolerModels = pgTable(
  "cooler_models",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    radiatorMm: integer("radiator_mm").notNull(),
    fanComponentId: uuid("fan_component_id").notNull().references(() => components.id),
    fanCount: integer("fan_count").notNull(),
    pumpComponentId: uuid("pump_component_id").notNull().references(() => components.id),
    boardModelId: uuid("board_model_id").notNull().references(() => boardModels.id),
    radiatorKPerWAtMinFan: doublePrecision("radiator_k_per_w_at_min_fan").notNull(),
    radiatorKPerWAtMaxFan: doublePrecision("radiator_k_per_w_at_max_fan").notNull(),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("cooler_models_name_key").on(t.name),
    index("cooler_models_fan_idx").on(t.fanComponentId),
    index("cooler_models_pump_idx").on(t.pumpComponentId),
    index("cooler_models_board_idx").on(t.boardModelId),
    check("cooler_models_fan_count", sql`${t.fanCount} between 1 and 12`),
    check("cooler_models_resistance_order", sql`${t.radiatorKPerWAtMaxFan} > 0 and ${t.radiatorKPerWAtMinFan} >= ${t.radiatorKPerWAtMaxFan}`),
  ],
);

// ---------------------------------------------------------------- profiles

export const profiles = pgTable(
  "profiles",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    coolerModelId: uuid("cooler_model_id").notNull().references(() => coolerModels.id),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    ownerUserId: uuid("owner_user_id").notNull().references(() => users.id),
    /** The working copy the editor autosaves, exactly as typed (key order, spacing, even broken JSON); published versions are separate and immutable. */
    draftText: text("draft_text"),
    /**
     * The last draft that passed the schema, as parsed JSON (key order not kept): the editor
     * plots it while the draft text is broken. Rows from before draftText hold the draft here.
     */
    draftDocument: jsonb("draft_document"),
    draftUpdatedAt: timestamp("draft_updated_at", { withTimezone: true }),
    /** Bumped on every draft save: a save based on an older number is refused (optimistic concurrency). */
    draftRevision: integer("draft_revision").notNull().default(0),
    /** Who saved the draft last, so a refused stale save can say who saved in between. */
    draftSavedByUserId: uuid("draft_saved_by_user_id").references(() => users.id),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("profiles_cooler_name_key").on(t.coolerModelId, t.name),
    index("profiles_cooler_idx").on(t.coolerModelId),
    index("profiles_owner_idx").on(t.ownerUserId),
    index("profiles_draft_saved_by_idx").on(t.draftSavedByUserId),
  ],
);

export const profileVersions = pgTable(
  "profile_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    profileId: uuid("profile_id").notNull().references(() => profiles.id),
    version: text("version").notNull(),
    versionMajor: integer("version_major").notNull(),
    versionMinor: integer("version_minor").notNull(),
    versionPatch: integer("version_patch").notNull(),
    boardRange: text("board_range").notNull(),
    document: jsonb("document").notNull(),
    encodedBytes: integer("encoded_bytes").notNull(),
    crc32: bigint("crc32", { mode: "number" }).notNull(),
    contentHash: text("content_hash").notNull(),
    changelog: text("changelog").notNull(),
    authorUserId: uuid("author_user_id").notNull().references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("profile_versions_profile_version_key").on(t.profileId, t.version),
    index("profile_versions_profile_idx").on(t.profileId),
    index("profile_versions_author_idx").on(t.authorUserId),
    index("profile_versions_content_hash_idx").on(t.contentHash),
  ],
);

// ---------------------------------------------------------------- files

export const uploadKindEnum = pgEnum("upload_kind", ["firmware", "lab_report", "measurements", "bank_bin", "bank_hex", "dump", "lots_csv"]);

export const uploads = pgTable(
  "uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kind: uploadKindEnum("kind").notNull(),
    storageKey: text("storage_key").notNull(),
    originalName: text("original_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    uploadedByUserId: uuid("uploaded_by_user_id").references(() => users.id),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("uploads_storage_key_key").on(t.storageKey), index("uploads_uploader_idx").on(t.uploadedByUserId)],
);

// ---------------------------------------------------------------- builds and stages

export const buildStageEnum = pgEnum("build_stage", STAGE_ORDER);

export const builds = pgTable(
  "builds",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    boardModelId: uuid("board_model_id").notNull().references(() => boardModels.id),
    version: text("version").notNull(),
    revisionRange: text("revision_range").notNull(),
    stage: buildStageEnum("stage").notNull().default("draft"),
    authorUserId: uuid("author_user_id").notNull().references(() => users.id),
    firmwareUploadId: uuid("firmware_upload_id").references(() => uploads.id),
    labReportUploadId: uuid("lab_report_upload_id").references(() => uploads.id),
    measurementsUploadId: uuid("measurements_upload_id").references(() => uploads.id),
    bankImage: bytea("bank_image"),
    bankBytes: integer("bank_bytes"),
    bankSha256: text("bank_sha256"),
    bankCrc32: bigint("bank_crc32", { mode: "number" }),
    /** Ed25519 signature of bank_image, made when the build enters pilot (docs/bank-format.md). */
    bankSignature: bytea("bank_signature"),
    bankSignatureKeyId: text("bank_signature_key_id"),
    releaseNotes: text("release_notes"),
    waiverReason: text("waiver_reason"),
    withdrawnReason: text("withdrawn_reason"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("builds_board_version_key").on(t.boardModelId, t.version),
    index("builds_board_idx").on(t.boardModelId),
    index("builds_stage_idx").on(t.stage),
    index("builds_author_idx").on(t.authorUserId),
    index("builds_firmware_idx").on(t.firmwareUploadId),
    index("builds_lab_report_idx").on(t.labReportUploadId),
    index("builds_measurements_idx").on(t.measurementsUploadId),
    check("builds_withdrawn_has_reason", sql`${t.stage} <> 'withdrawn' or ${t.withdrawnReason} is not null`),
    check("builds_signature_has_key", sql`(${t.bankSignature} is null) = (${t.bankSignatureKeyId} is null)`),
  ],
);

/** Public keys that bank signatures of a board model verify with; a rotated key keeps its row, closed by valid_until. */
export const bankSigningKeys = pgTable(
  "bank_signing_keys",
  {
    boardModelId: uuid("board_model_id").notNull().references(() => boardModels.id),
    keyId: text("key_id").notNull(),
    publicKeyPem: text("public_key_pem").notNull(),
    validFrom: timestamp("valid_from", { withTimezone: true }).notNull().defaultNow(),
    validUntil: timestamp("valid_until", { withTimezone: true }),
  },
  (t) => [
    primaryKey({ columns: [t.boardModelId, t.keyId] }),
    index("bank_signing_keys_board_idx").on(t.boardModelId),
    check("bank_signing_keys_key_id_hex", sql`${t.keyId} ~ '^[0-9a-f]{16}$'`),
  ],
);

export const buildSlots = pgTable(
  "build_slots",
  {
    buildId: uuid("build_id").notNull().references(() => builds.id, { onDelete: "cascade" }),
    slotIndex: integer("slot_index").notNull(),
    profileVersionId: uuid("profile_version_id").notNull().references(() => profileVersions.id),
  },
  (t) => [primaryKey({ columns: [t.buildId, t.slotIndex] }), index("build_slots_profile_version_idx").on(t.profileVersionId)],
);

export const reviewVerdictEnum = pgEnum("review_verdict", ["approve", "request_changes"]);

export const buildReviews = pgTable(
  "build_reviews",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    buildId: uuid("build_id").notNull().references(() => builds.id, { onDelete: "cascade" }),
    reviewerUserId: uuid("reviewer_user_id").notNull().references(() => users.id),
    verdict: reviewVerdictEnum("verdict").notNull(),
    comment: text("comment").notNull().default(""),
    /** A change request stays open until the author resolves it. */
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /** Set when the reviewer changes their verdict (an explicit update, never a second row). */
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("build_reviews_build_idx").on(t.buildId),
    index("build_reviews_reviewer_idx").on(t.reviewerUserId),
    // One review per reviewer per build: a second approval is a mistake, not a second vote.
    uniqueIndex("build_reviews_build_reviewer_key").on(t.buildId, t.reviewerUserId),
  ],
);

export const buildTransitions = pgTable(
  "build_transitions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    buildId: uuid("build_id").notNull().references(() => builds.id, { onDelete: "cascade" }),
    fromStage: buildStageEnum("from_stage").notNull(),
    toStage: buildStageEnum("to_stage").notNull(),
    actorUserId: uuid("actor_user_id").notNull().references(() => users.id),
    reason: text("reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("build_transitions_build_idx").on(t.buildId), index("build_transitions_actor_idx").on(t.actorUserId)],
);

// ---------------------------------------------------------------- outgoing mail

export const mailStatusEnum = pgEnum("mail_status", ["pending", "sent", "failed"]);

export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    toAddresses: text("to_addresses").array().notNull(),
    subject: text("subject").notNull(),
    bodyText: text("body_text").notNull(),
    status: mailStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    lastError: text("last_error"),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_outbox_due_idx").on(t.status, t.nextAttemptAt)],
);

/** Messages the local fake SMTP server received (development and tests only). */
export const localMailbox = pgTable(
  "local_mailbox",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    fromAddress: text("from_address").notNull(),
    toAddresses: text("to_addresses").array().notNull(),
    subject: text("subject").notNull(),
    raw: text("raw").notNull(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("local_mailbox_received_idx").on(t.receivedAt)],
);

// ---------------------------------------------------------------- production

export const productionLots = pgTable(
  "production_lots",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    lotCode: text("lot_code").notNull(),
    boardModelId: uuid("board_model_id").notNull().references(() => boardModels.id),
    boardRevisionId: uuid("board_revision_id").notNull().references(() => boardRevisions.id),
    buildId: uuid("build_id").notNull().references(() => builds.id),
    serialFrom: bigint("serial_from", { mode: "number" }).notNull(),
    serialTo: bigint("serial_to", { mode: "number" }).notNull(),
    producedOn: date("produced_on").notNull(),
    line: text("line").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("production_lots_code_key").on(t.lotCode),
    // The serial lookup walks this btree: serial_from <= $s order by serial_from desc limit 1.
    index("production_lots_model_serial_idx").on(t.boardModelId, t.serialFrom),
    index("production_lots_revision_idx").on(t.boardRevisionId),
    index("production_lots_build_idx").on(t.buildId),
    check("production_lots_range_order", sql`${t.serialFrom} >= 0 and ${t.serialTo} >= ${t.serialFrom}`),
  ],
);

export const recentLookups = pgTable(
  "recent_lookups",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    serial: text("serial").notNull(),
    found: boolean("found").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("recent_lookups_user_idx").on(t.userId, t.createdAt)],
);

/** Fixed-window request counters per API token or account; shared by every instance. */
export const rateLimits = pgTable(
  "rate_limits",
  {
    key: text("key").notNull(),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull(),
    count: integer("count").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.key, t.windowStart] })],
);

// ---------------------------------------------------------------- relations

export const usersRelations = relations(users, ({ many }) => ({ apiTokens: many(apiTokens), profiles: many(profiles) }));
export const apiTokensRelations = relations(apiTokens, ({ one }) => ({ user: one(users, { fields: [apiTokens.userId], references: [users.id] }) }));
export const boardModelsRelations = relations(boardModels, ({ many }) => ({ revisions: many(boardRevisions), coolerModels: many(coolerModels) }));
export const boardRevisionsRelations = relations(boardRevisions, ({ one }) => ({
  boardModel: one(boardModels, { fields: [boardRevisions.boardModelId], references: [boardModels.id] }),
}));
export const coolerModelsRelations = relations(coolerModels, ({ one, many }) => ({
  fan: one(components, { fields: [coolerModels.fanComponentId], references: [components.id], relationName: "fan" }),
  pump: one(components, { fields: [coolerModels.pumpComponentId], references: [components.id], relationName: "pump" }),
  boardModel: one(boardModels, { fields: [coolerModels.boardModelId], references: [boardModels.id] }),
  profiles: many(profiles),
}));
export const profilesRelations = relations(profiles, ({ one, many }) => ({
  coolerModel: one(coolerModels, { fields: [profiles.coolerModelId], references: [coolerModels.id] }),
  owner: one(users, { fields: [profiles.ownerUserId], references: [users.id] }),
  versions: many(profileVersions),
}));
export const profileVersionsRelations = relations(profileVersions, ({ one }) => ({
  profile: one(profiles, { fields: [profileVersions.profileId], references: [profiles.id] }),
  author: one(users, { fields: [profileVersions.authorUserId], references: [users.id] }),
}));
export const buildsRelations = relations(builds, ({ one, many }) => ({
  boardModel: one(boardModels, { fields: [builds.boardModelId], references: [boardModels.id] }),
  author: one(users, { fields: [builds.authorUserId], references: [users.id] }),
  slots: many(buildSlots),
  reviews: many(buildReviews),
  transitions: many(buildTransitions),
}));
export const buildSlotsRelations = relations(buildSlots, ({ one }) => ({
  build: one(builds, { fields: [buildSlots.buildId], references: [builds.id] }),
  profileVersion: one(profileVersions, { fields: [buildSlots.profileVersionId], references: [profileVersions.id] }),
}));
export const buildReviewsRelations = relations(buildReviews, ({ one }) => ({
  build: one(builds, { fields: [buildReviews.buildId], references: [builds.id] }),
  reviewer: one(users, { fields: [buildReviews.reviewerUserId], references: [users.id] }),
}));
export const buildTransitionsRelations = relations(buildTransitions, ({ one }) => ({
  build: one(builds, { fields: [buildTransitions.buildId], references: [builds.id] }),
  actor: one(users, { fields: [buildTransitions.actorUserId], references: [users.id] }),
}));
export const productionLotsRelations = relations(productionLots, ({ one }) => ({
  boardModel: one(boardModels, { fields: [productionLots.boardModelId], references: [boardModels.id] }),
  boardRevision: one(boardRevisions, { fields: [productionLots.boardRevisionId], references: [boardRevisions.id] }),
  build: one(builds, { fields: [productionLots.buildId], references: [builds.id] }),
}));

// ---------------------------------------------------------------- inferred types

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Role = (typeof roleEnum.enumValues)[number];
export type ApiToken = typeof apiTokens.$inferSelect;
export type NewApiToken = typeof apiTokens.$inferInsert;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type NewAuditEvent = typeof auditEvents.$inferInsert;
export type Component = typeof components.$inferSelect;
export type NewComponent = typeof components.$inferInsert;
export type BoardModel = typeof boardModels.$inferSelect;
export type NewBoardModel = typeof boardModels.$inferInsert;
export type BoardRevision = typeof boardRevisions.$inferSelect;
export type NewBoardRevision = typeof boardRevisions.$inferInsert;
export type CoolerModel = typeof coolerModels.$inferSelect;
export type NewCoolerModel = typeof coolerModels.$inferInsert;
export type Profile = typeof profiles.$inferSelect;
export type NewProfile = typeof profiles.$inferInsert;
export type ProfileVersion = typeof profileVersions.$inferSelect;
export type NewProfileVersion = typeof profileVersions.$inferInsert;
export type Upload = typeof uploads.$inferSelect;
export type NewUpload = typeof uploads.$inferInsert;
export type Build = typeof builds.$inferSelect;
export type NewBuild = typeof builds.$inferInsert;
export type BuildStage = (typeof buildStageEnum.enumValues)[number];
export type BuildSlot = typeof buildSlots.$inferSelect;
export type BuildReview = typeof buildReviews.$inferSelect;
export type BuildTransition = typeof buildTransitions.$inferSelect;
export type MailOutboxRow = typeof mailOutbox.$inferSelect;
export type LocalMailboxRow = typeof localMailbox.$inferSelect;
export type ProductionLot = typeof productionLots.$inferSelect;
export type NewProductionLot = typeof productionLots.$inferInsert;

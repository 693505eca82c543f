// The whole database in one place. Tables and columns are snake_case in SQL
// and camelCase here. Generated files and bundles are stored in full so that a
// revision is reproducible and diffable without re-running the engine.
import { relations } from "drizzle-orm";
import {
  type AnyPgColumn,
  boolean,
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  serial,
  text,
  timestamp,
  uniqueIndex,
} from "drizzle-orm/pg-core";

const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});

export const roleEnum = pgEnum("role", ["admin", "engineer", "reviewer", "technician"]);
// Values renamed in place by drizzle/*_review-state-words-data.sql; see lib/review/words.ts.
// A revision exists from the moment "generate" is pressed; a worker builds it (lib/revisions/build-state.ts).
export const buildStateEnum = pgEnum("build_state", ["building", "ready", "failed"]);

export const revisionStateEnum = pgEnum("revision_state", [
  "prepared",
  "awaiting_check",
  "released",
  "returned",
]);
export const reviewDecisionEnum = pgEnum("review_decision", ["release", "return"]);

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable("users", {
  id: serial("id").primaryKey(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  passwordHash: text("password_hash"),
  role: roleEnum("role").notNull(),
  // Technicians see approved bundles of this site only; null = every site.
  site: text("site"),
  disabled: boolean("disabled").notNull().default(false),
  // Raised on sign-out, disabling and re-enabling: every session cookie
  // carrying an older value stops working at once (lib/auth/guard.ts).
  sessionVersion: integer("session_version").notNull().default(0),
  createdAt: createdAt(),
});

export const retrofits = pgTable(
  "retrofits",
  {
    id: serial("id").primaryKey(),
    name: text("name").notNull(),
    site: text("site").notNull(),
    assetTag: text("asset_tag").notNull(),
    boardRef: text("board_ref").notNull().default(""),
    description: text("description").notNull().default(""),
    mainsPowered: boolean("mains_powered").notNull().default(false),
    drivesThyristor: boolean("drives_thyristor").notNull().default(false),
    createdBy: integer("created_by").references(() => users.id),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    archivedAt: timestamp("archived_at", { withTimezone: true }),
  },
  (t) => [index("retrofits_site_idx").on(t.site)],
);

// The working copy of the old circuit; revisions snapshot it.
export const stages = pgTable("stages", {
  id: serial("id").primaryKey(),
  retrofitId: integer("retrofit_id")
    .notNull()
    .unique()
    .references(() => retrofits.id),
  kind: text("kind").notNull(),
  // Stage fields in SI units, exactly the engine's Stage shape (tolerances included).
  values: jsonb("values").notNull(),
  // The adjustable value (pot, trimmer, selector) as the engine's StageControl; null = all values fixed.
  control: jsonb("control"),
  // Set when the stage came from a capture's measurement.
  captureId: integer("capture_id"),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

export const targets = pgTable(
  "targets",
  {
    id: serial("id").primaryKey(),
    retrofitId: integer("retrofit_id")
      .notNull()
      .references(() => retrofits.id),
    position: integer("position").notNull(),
    device: text("device").notNull(),
    clockSource: text("clock_source").notNull(),
    clockHz: doublePrecision("clock_hz").notNull(),
    clockAccuracyPpm: doublePrecision("clock_accuracy_ppm"),
    mode: text("mode"),
    timer: text("timer"),
    pin: text("pin"),
    activeLow: boolean("active_low").notNull().default(false),
    requiredTolerancePct: doublePrecision("required_tolerance_pct"),
    // Triggered start (engine.md section 6) and gate-drive needs: null = free-running / none.
    // Shapes: TargetTrigger and GateDrive in lib/revisions/types.ts (SI units).
    trigger: jsonb("trigger"),
    gateDrive: jsonb("gate_drive"),
    createdAt: createdAt(),
  },
  (t) => [index("targets_retrofit_idx").on(t.retrofitId)],
);

export const captures = pgTable("captures", {
  id: serial("id").primaryKey(),
  retrofitId: integer("retrofit_id").references(() => retrofits.id),
  uploadedBy: integer("uploaded_by")
    .notNull()
    .references(() => users.id),
  fileName: text("file_name").notNull(),
  byteSize: integer("byte_size").notNull(),
  sha256: text("sha256").notNull(),
  content: bytea("content").notNull(),
  measurement: jsonb("measurement").notNull(),
  createdAt: createdAt(),
});

// A capture parsed once at upload into blocks of a min/max pyramid
// (lib/field/capture-levels.ts): level 0 holds the samples (t, v as float64
// pairs), level k >= 1 entries (t of the first sample, min, max) of
// CAPTURE_FAN^k samples each. A zoomed plot reads only the blocks of one
// level that overlap its window. Deleted with the capture.
export const captureLevels = pgTable(
  "capture_levels",
  {
    captureId: integer("capture_id")
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    level: integer("level").notNull(),
    block: integer("block").notNull(),
    /** Index within the level of the block's first entry. */
    firstIndex: integer("first_index").notNull(),
    entries: integer("entries").notNull(),
    /** Time of the block's first and last entry (s). */
    startS: doublePrecision("start_s").notNull(),
    endS: doublePrecision("end_s").notNull(),
    data: bytea("data").notNull(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.level, t.block] })],
);

export const revisions = pgTable(
  "revisions",
  {
    id: serial("id").primaryKey(),
    retrofitId: integer("retrofit_id")
      .notNull()
      .references(() => retrofits.id),
    number: integer("number").notNull(),
    state: revisionStateEnum("state").notNull().default("prepared"),
    // Snapshot of the inputs and results: the exact BundleSpec and plans.
    spec: jsonb("spec").notNull(),
    analysis: jsonb("analysis").notNull(),
    plans: jsonb("plans").notNull(),
    engineVersion: text("engine_version").notNull(),
    bundle: bytea("bundle").notNull(),
    bundleSha256: text("bundle_sha256").notNull(),
    bundleSize: integer("bundle_size").notNull(),
    note: text("note").notNull().default(""),
    createdBy: integer("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    decidedBy: integer("decided_by").references(() => users.id),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    // Set when a newer revision of the same retrofit is approved.
    supersededAt: timestamp("superseded_at", { withTimezone: true }),
    // Rows made before builds ran on workers were built in their request: "ready".
    // While building, bundle is empty and bundle_sha256 is "" (downloads refuse).
    buildState: buildStateEnum("build_state").notNull().default("ready"),
    buildError: text("build_error"),
    // Per target folder: { index, device, step, reason? } (BuildProgress)
    buildProgress: jsonb("build_progress").notNull().default({}),
    // Per target folder: the emulator's verdict on the built image (TargetEmulation,
    // lib/revisions/emulations.ts); {} for revisions built before emulation ran.
    emulations: jsonb("emulations").notNull().default({}),
    // Why the author sent a revision with a target not proven in an emulator (given at submit).
    unprovenReason: text("unproven_reason"),
  },
  (t) => [uniqueIndex("revisions_retrofit_number_uq").on(t.retrofitId, t.number)],
);

export const revisionFiles = pgTable(
  "revision_files",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => revisions.id),
    path: text("path").notNull(),
    content: text("content").notNull(),
    sha256: text("sha256").notNull(),
  },
  (t) => [uniqueIndex("revision_files_path_uq").on(t.revisionId, t.path)],
);

// Ready-to-flash images of a revision (<device>/firmware/*): bytes, kept apart
// from the text files so diffs, comments and file views read text only.
export const revisionImages = pgTable(
  "revision_images",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => revisions.id),
    path: text("path").notNull(),
    content: bytea("content").notNull(),
    size: integer("size").notNull(),
    sha256: text("sha256").notNull(),
  },
  (t) => [uniqueIndex("revision_images_path_uq").on(t.revisionId, t.path)],
);

export const reviews = pgTable("reviews", {
  id: serial("id").primaryKey(),
  revisionId: integer("revision_id")
    .notNull()
    .references(() => revisions.id),
  reviewerId: integer("reviewer_id")
    .notNull()
    .references(() => users.id),
  decision: reviewDecisionEnum("decision").notNull(),
  note: text("note").notNull().default(""),
  /** Release despite a target whose budget misses: the reviewer's reason (null = no override). */
  overrideReason: text("override_reason"),
  /** The targets the override covers: [{ position, device, findings }] as judged at release. */
  overrideTargets: jsonb("override_targets"),
  createdAt: createdAt(),
});

// What a comment is about: the revision as a whole, a file, a line of a file,
// a quantity of a target ("target1.periodS") or a register ("target1.register.ICR1").
export const commentAnchorEnum = pgEnum("comment_anchor_kind", [
  "revision",
  "file",
  "line",
  "quantity",
  "register",
]);

export const comments = pgTable(
  "comments",
  {
    id: serial("id").primaryKey(),
    revisionId: integer("revision_id")
      .notNull()
      .references(() => revisions.id),
    authorId: integer("author_id")
      .notNull()
      .references(() => users.id),
    body: text("body").notNull(),
    filePath: text("file_path"),
    line: integer("line"),
    anchorKind: commentAnchorEnum("anchor_kind").notNull().default("revision"),
    /** quantity / register anchors: the key of lib/review/anchors.ts */
    anchorKey: text("anchor_key"),
    /** the anchored value or line text when the comment was written, to mark a carried comment "changed" */
    anchorText: text("anchor_text"),
    /** a reply's thread (the first comment); replies carry no anchor of their own */
    parentId: integer("parent_id").references((): AnyPgColumn => comments.id),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    resolvedBy: integer("resolved_by").references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("comments_revision_idx").on(t.revisionId), index("comments_parent_idx").on(t.parentId)],
);

export const fieldChecks = pgTable("field_checks", {
  id: serial("id").primaryKey(),
  revisionId: integer("revision_id")
    .notNull()
    .references(() => revisions.id),
  technicianId: integer("technician_id")
    .notNull()
    .references(() => users.id),
  measuredPeriodS: doublePrecision("measured_period_s"),
  measuredHighS: doublePrecision("measured_high_s"),
  captureId: integer("capture_id").references(() => captures.id),
  // One entry per checklist line: limits computed by the server, value, pass/fail.
  lines: jsonb("lines").notNull(),
  passed: boolean("passed").notNull(),
  notes: text("notes").notNull().default(""),
  signedOffBy: text("signed_off_by").notNull(),
  // The CHECKLIST.md lines ticked or measured on the phone (lib/field/record-steps.ts); [] for checks without them.
  steps: jsonb("steps").notNull().default([]),
  createdAt: createdAt(),
});

// A photo taken for one checklist line of a field check (JPEG or PNG, downscaled in the browser).
export const fieldCheckPhotos = pgTable(
  "field_check_photos",
  {
    id: serial("id").primaryKey(),
    fieldCheckId: integer("field_check_id")
      .notNull()
      .references(() => fieldChecks.id),
    stepId: text("step_id").notNull(),
    mediaType: text("media_type").notNull(),
    byteSize: integer("byte_size").notNull(),
    sha256: text("sha256").notNull(),
    content: bytea("content").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("field_check_photos_check_idx").on(t.fieldCheckId)],
);

export const auditEvents = pgTable(
  "audit_events",
  {
    id: serial("id").primaryKey(),
    actorId: integer("actor_id").references(() => users.id),
    action: text("action").notNull(),
    subjectType: text("subject_type"),
    subjectId: integer("subject_id"),
    details: jsonb("details").notNull().default({}),
    createdAt: createdAt(),
  },
  (t) => [index("audit_events_created_idx").on(t.createdAt), index("audit_events_action_idx").on(t.action)],
);

export const apiTokens = pgTable("api_tokens", {
  id: serial("id").primaryKey(),
  userId: integer("user_id")
    .notNull()
    .references(() => users.id),
  name: text("name").notNull(),
  // sha256 of the secret; the secret itself is shown once and never stored.
  tokenHash: text("token_hash").notNull().unique(),
  prefix: text("prefix").notNull(),
  createdAt: createdAt(),
  lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
  revokedAt: timestamp("revoked_at", { withTimezone: true }),
});

export const invitations = pgTable("invitations", {
  id: serial("id").primaryKey(),
  email: text("email").notNull(),
  name: text("name").notNull(),
  role: roleEnum("role").notNull(),
  site: text("site"),
  tokenHash: text("token_hash").notNull().unique(),
  invitedBy: integer("invited_by")
    .notNull()
    .references(() => users.id),
  expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  usedAt: timestamp("used_at", { withTimezone: true }),
  createdAt: createdAt(),
});

// Every message goes through here first, so a mail server outage never loses it.
export const mailOutbox = pgTable("mail_outbox", {
  id: serial("id").primaryKey(),
  kind: text("kind").notNull(),
  toAddress: text("to_address").notNull(),
  subject: text("subject").notNull(),
  body: text("body").notNull(),
  attempts: integer("attempts").notNull().default(0),
  lastError: text("last_error"),
  sentAt: timestamp("sent_at", { withTimezone: true }),
  createdAt: createdAt(),
});

// Sign-in throttling counters (lib/auth/throttle.ts), one row per key:
// "pair:<email> <address>", "account:<email>", "address:<address>". Each
// attempt changes a row in one INSERT ... ON CONFLICT DO UPDATE ... RETURNING.
export const signInCounters = pgTable("sign_in_counters", {
  key: text("key").primaryKey(),
  attempts: integer("attempts").notNull().default(0),
  lastAt: timestamp("last_at", { withTimezone: true }).notNull().defaultNow(),
  nextAt: timestamp("next_at", { withTimezone: true }).notNull().defaultNow(),
  lastAllowed: boolean("last_allowed").notNull().default(true),
});

export const retrofitsRelations = relations(retrofits, ({ one, many }) => ({
  stage: one(stages, { fields: [retrofits.id], references: [stages.retrofitId] }),
  targets: many(targets),
  revisions: many(revisions),
}));
export const revisionsRelations = relations(revisions, ({ one, many }) => ({
  retrofit: one(retrofits, { fields: [revisions.retrofitId], references: [retrofits.id] }),
  files: many(revisionFiles),
  images: many(revisionImages),
  reviews: many(reviews),
  comments: many(comments),
}));
export const revisionFilesRelations = relations(revisionFiles, ({ one }) => ({
  revision: one(revisions, { fields: [revisionFiles.revisionId], references: [revisions.id] }),
}));
export const revisionImagesRelations = relations(revisionImages, ({ one }) => ({
  revision: one(revisions, { fields: [revisionImages.revisionId], references: [revisions.id] }),
}));
export const stagesRelations = relations(stages, ({ one }) => ({
  retrofit: one(retrofits, { fields: [stages.retrofitId], references: [retrofits.id] }),
}));
export const targetsRelations = relations(targets, ({ one }) => ({
  retrofit: one(retrofits, { fields: [targets.retrofitId], references: [retrofits.id] }),
}));
export const reviewsRelations = relations(reviews, ({ one }) => ({
  revision: one(revisions, { fields: [reviews.revisionId], references: [revisions.id] }),
}));
export const commentsRelations = relations(comments, ({ one }) => ({
  revision: one(revisions, { fields: [comments.revisionId], references: [revisions.id] }),
}));

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Role = (typeof roleEnum.enumValues)[number];
export type Retrofit = typeof retrofits.$inferSelect;
export type NewRetrofit = typeof retrofits.$inferInsert;
export type StageRow = typeof stages.$inferSelect;
export type TargetRow = typeof targets.$inferSelect;
export type Revision = typeof revisions.$inferSelect;
export type RevisionState = (typeof revisionStateEnum.enumValues)[number];
export type RevisionFile = typeof revisionFiles.$inferSelect;
export type RevisionImage = typeof revisionImages.$inferSelect;
export type Review = typeof reviews.$inferSelect;
export type Comment = typeof comments.$inferSelect;
export type Capture = typeof captures.$inferSelect;
export type FieldCheck = typeof fieldChecks.$inferSelect;
export type FieldCheckPhoto = typeof fieldCheckPhotos.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;

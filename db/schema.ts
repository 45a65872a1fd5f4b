import { sql } from "drizzle-orm";
import {
  bigint,
  bigserial,
  boolean,
  customType,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  real,
  serial,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
} from "drizzle-orm/pg-core";
import type { AdapterAccountType } from "next-auth/adapters";
import type { FeatureSchema, ProjectSettings } from "@/lib/projects/settings";

/** Packed little-endian float32 values (an item's raw feature vector). */
export const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});

const createdAt = () => timestamp("created_at", { withTimezone: true, mode: "date" }).notNull().defaultNow();

export const roleEnum = pgEnum("project_role", ["owner", "reviewer", "annotator", "viewer"]);
export const itemStatusEnum = pgEnum("item_status", ["unlabelled", "in_progress", "agreed", "disputed", "ruled", "control"]);
export const labelSourceEnum = pgEnum("label_source", ["agreed", "ruling", "single", "control"]);
export const jobStatusEnum = pgEnum("job_status", ["pending", "running", "succeeded", "failed", "cancelled"]);
export const disputeReasonEnum = pgEnum("dispute_reason", ["disagreement", "doubt"]);
export const disputeStatusEnum = pgEnum("dispute_status", ["open", "ruled"]);

// ---------- Auth.js adapter tables (+ password hash, admin flag, deactivation) ----------

export const users = pgTable("users", {
  id: text("id").primaryKey().$defaultFn(() => crypto.randomUUID()),
  name: text("name"),
  email: text("email").notNull().unique(),
  emailVerified: timestamp("email_verified", { withTimezone: true, mode: "date" }),
  image: text("image"),
  passwordHash: text("password_hash"),
  isAdmin: boolean("is_admin").notNull().default(false),
  deactivatedAt: timestamp("deactivated_at", { withTimezone: true, mode: "date" }),
  createdAt: createdAt(),
});

export const accounts = pgTable(
  "accounts",
  {
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    type: text("type").$type<AdapterAccountType>().notNull(),
    provider: text("provider").notNull(),
    providerAccountId: text("provider_account_id").notNull(),
    refresh_token: text("refresh_token"),
    access_token: text("access_token"),
    expires_at: integer("expires_at"),
    token_type: text("token_type"),
    scope: text("scope"),
    id_token: text("id_token"),
    session_state: text("session_state"),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] }), index("accounts_user_id_idx").on(t.userId)],
);

export const sessions = pgTable(
  "sessions",
  {
    sessionToken: text("session_token").primaryKey(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    expires: timestamp("expires", { withTimezone: true, mode: "date" }).notNull(),
  },
  (t) => [index("sessions_user_id_idx").on(t.userId)],
);

export const verificationTokens = pgTable(
  "verification_tokens",
  {
    identifier: text("identifier").notNull(),
    token: text("token").notNull(),
    expires: timestamp("expires", { withTimezone: true, mode: "date" }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);

export const passwordResets = pgTable(
  "password_resets",
  {
    id: serial("id").primaryKey(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [index("password_resets_user_id_idx").on(t.userId)],
);

export const apiTokens = pgTable(
  "api_tokens",
  {
    id: serial("id").primaryKey(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    prefix: text("prefix").notNull(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true, mode: "date" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [index("api_tokens_user_id_idx").on(t.userId)],
);

// ---------- Projects and membership ----------

export const projects = pgTable("projects", {
  id: serial("id").primaryKey(),
  name: text("name").notNull(),
  description: text("description").notNull().default(""),
  settings: jsonb("settings").$type<ProjectSettings>().notNull(),
  featureSchema: jsonb("feature_schema").$type<FeatureSchema | null>(),
  createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
  createdAt: createdAt(),
  updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
});

export const projectMembers = pgTable(
  "project_members",
  {
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.userId] }), index("project_members_user_id_idx").on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: text("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true, mode: "date" }),
    revokedAt: timestamp("revoked_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_project_id_idx").on(t.projectId), index("invitations_invited_by_idx").on(t.invitedBy)],
);

export const labelClasses = pgTable(
  "label_classes",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    colour: text("colour").notNull(),
    keyHint: integer("key_hint").notNull(),
    position: integer("position").notNull(),
  },
  (t) => [uniqueIndex("label_classes_project_name_idx").on(t.projectId, t.name), index("label_classes_project_id_idx").on(t.projectId)],
);

// ---------- Uploads and imports ----------

export const uploads = pgTable(
  "uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    objectKey: text("object_key").notNull(),
    fileName: text("file_name").notNull(),
    size: bigint("size", { mode: "number" }).notNull(),
    contentType: text("content_type").notNull().default("application/octet-stream"),
    status: text("status").$type<"pending" | "uploaded" | "failed">().notNull().default("pending"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [index("uploads_project_id_idx").on(t.projectId), index("uploads_created_by_idx").on(t.createdBy)],
);

export const imports = pgTable(
  "imports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    uploadIds: jsonb("upload_ids").$type<string[]>().notNull(),
    format: text("format").notNull(),
    options: jsonb("options").$type<Record<string, unknown>>().notNull().default({}),
    status: jobStatusEnum("status").notNull().default("pending"),
    rowsDone: integer("rows_done").notNull().default(0),
    rowsTotal: integer("rows_total"),
    itemsCreated: integer("items_created").notNull().default(0),
    itemsSkipped: integer("items_skipped").notNull().default(0),
    errorCount: integer("error_count").notNull().default(0),
    errors: jsonb("errors").$type<Array<{ row: number | null; column: string | null; message: string }>>().notNull().default([]),
    errorReportKey: text("error_report_key"),
    message: text("message"),
    cancelRequested: boolean("cancel_requested").notNull().default(false),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    startedAt: timestamp("started_at", { withTimezone: true, mode: "date" }),
    /** Touched every few seconds by the worker running the import; a running import whose heartbeat stops is retried. */
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true, mode: "date" }),
    finishedAt: timestamp("finished_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [index("imports_project_id_idx").on(t.projectId), index("imports_created_by_idx").on(t.createdBy)],
);

// ---------- Items, assignments, labels ----------

const openItem = sql`status in ('unlabelled', 'in_progress') and not is_control and final_class_id is null`;

export const items = pgTable(
  "items",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    externalId: text("external_id").notNull(),
    fields: jsonb("fields").$type<Record<string, unknown>>().notNull().default({}),
    vector: bytea("vector"),
    imageKey: text("image_key"),
    thumbKey: text("thumb_key"),
    // No foreign key: it costs ~6 s per million imported rows, and an import row is never deleted before its items.
    importId: uuid("import_id"),
    seq: bigserial("seq", { mode: "number" }).notNull(),
    randomKey: real("random_key").notNull().default(sql`random()`),
    isControl: boolean("is_control").notNull().default(false),
    knownClassId: integer("known_class_id").references(() => labelClasses.id, { onDelete: "set null" }),
    isBlind: boolean("is_blind").notNull().default(false),
    priorClassId: integer("prior_class_id").references(() => labelClasses.id, { onDelete: "set null" }),
    status: itemStatusEnum("status").notNull().default("unlabelled"),
    labelCount: integer("label_count").notNull().default(0),
    finalClassId: integer("final_class_id").references(() => labelClasses.id, { onDelete: "set null" }),
    finalSource: labelSourceEnum("final_source"),
    decidedAt: timestamp("decided_at", { withTimezone: true, mode: "date" }),
    poolShares: real("pool_shares").array(),
    poolTopClassId: integer("pool_top_class_id"),
    poolTopShare: real("pool_top_share"),
    scoreLeastConfident: real("score_least_confident"),
    scoreMargin: real("score_margin"),
    scoreEntropy: real("score_entropy"),
    poolVersion: bigint("pool_version", { mode: "number" }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("items_project_external_id_idx").on(t.projectId, t.externalId),
    index("items_project_status_idx").on(t.projectId, t.status),
    // Desk queue orders: each index yields its order directly over the open items only (see lib/labelling/queue.ts).
    // Score orders cover scored items only (scores are null until the first pool ranking, so an import does not
    // maintain them); unscored open items are served after them in import order (lib/labelling/queue.ts).
    index("items_queue_lc_idx").on(t.projectId, sql`${t.scoreLeastConfident} desc nulls last`, t.seq).where(sql`${openItem} and score_least_confident is not null`),
    index("items_queue_margin_idx").on(t.projectId, sql`${t.scoreMargin} asc nulls last`, t.seq).where(sql`${openItem} and score_margin is not null`),
    index("items_queue_entropy_idx").on(t.projectId, sql`${t.scoreEntropy} desc nulls last`, t.seq).where(sql`${openItem} and score_entropy is not null`),
    index("items_queue_random_idx").on(t.projectId, t.randomKey, t.seq).where(openItem),
    index("items_queue_seq_idx").on(t.projectId, t.seq),
    index("items_decided_at_idx").on(t.projectId, t.decidedAt).where(sql`${t.decidedAt} is not null`),
    // Partial where the column is empty at import time, so a bulk import does not pay for them (import_id is not indexed:
    // an import is all or nothing, so nothing looks items up by it).

    index("items_final_class_idx").on(t.projectId, t.finalClassId).where(sql`${t.finalClassId} is not null`),
    index("items_known_class_id_idx").on(t.knownClassId).where(sql`${t.knownClassId} is not null`),
    index("items_prior_class_id_idx").on(t.priorClassId).where(sql`${t.priorClassId} is not null`),
    index("items_pool_share_idx").on(t.projectId, t.poolTopShare, t.id).where(sql`${t.poolTopShare} is not null`),
  ],
);

export const assignments = pgTable(
  "assignments",
  {
    itemId: integer("item_id").notNull().references(() => items.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    leasedUntil: timestamp("leased_until", { withTimezone: true, mode: "date" }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ columns: [t.itemId, t.userId] }),
    index("assignments_user_id_idx").on(t.userId),
    index("assignments_project_lease_idx").on(t.projectId, t.leasedUntil),
  ],
);

export type SuggestionSnapshot = {
  shown: boolean;
  topClassId: number | null;
  shares: Record<string, number>;
  k: number;
  distance: string;
  engineVersion: string;
  knnVersion: number;
};

export const labels = pgTable(
  "labels",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    itemId: integer("item_id").notNull().references(() => items.id, { onDelete: "cascade" }),
    annotatorId: text("annotator_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    classId: integer("class_id").notNull().references(() => labelClasses.id, { onDelete: "cascade" }),
    suggestion: jsonb("suggestion").$type<SuggestionSnapshot | null>(),
    tookSuggestion: boolean("took_suggestion").notNull().default(false),
    clientSubmissionId: uuid("client_submission_id").notNull(),
    createdAt: createdAt(),
    undoneAt: timestamp("undone_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [
    uniqueIndex("labels_annotator_submission_idx").on(t.annotatorId, t.clientSubmissionId),
    uniqueIndex("labels_item_annotator_live_idx").on(t.itemId, t.annotatorId).where(sql`${t.undoneAt} is null`),
    index("labels_project_id_idx").on(t.projectId, t.id),
    index("labels_project_created_idx").on(t.projectId, t.createdAt),
    index("labels_project_undone_idx").on(t.projectId, t.undoneAt).where(sql`${t.undoneAt} is not null`),
    index("labels_item_id_idx").on(t.itemId),
    index("labels_annotator_id_idx").on(t.annotatorId, t.createdAt),
    index("labels_class_id_idx").on(t.classId),
  ],
);

export const itemFlags = pgTable(
  "item_flags",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    itemId: integer("item_id").notNull().references(() => items.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    kind: text("kind").$type<"skip" | "flag">().notNull(),
    comment: text("comment"),
    createdAt: createdAt(),
  },
  (t) => [
    index("item_flags_project_id_idx").on(t.projectId),
    index("item_flags_item_id_idx").on(t.itemId),
    index("item_flags_user_id_idx").on(t.userId),
  ],
);

// ---------- Disputes and rulings ----------

export const disputes = pgTable(
  "disputes",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    itemId: integer("item_id").notNull().references(() => items.id, { onDelete: "cascade" }),
    reason: disputeReasonEnum("reason").notNull(),
    status: disputeStatusEnum("status").notNull().default("open"),
    openedBy: text("opened_by").references(() => users.id, { onDelete: "set null" }),
    note: text("note"),
    openedAt: timestamp("opened_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
    closedAt: timestamp("closed_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [
    uniqueIndex("disputes_one_open_per_item_idx").on(t.itemId).where(sql`${t.status} = 'open'`),
    index("disputes_project_status_idx").on(t.projectId, t.status, t.openedAt),
    index("disputes_item_id_idx").on(t.itemId),
    index("disputes_opened_by_idx").on(t.openedBy),
  ],
);

export const rulings = pgTable(
  "rulings",
  {
    id: serial("id").primaryKey(),
    disputeId: integer("dispute_id").notNull().unique().references(() => disputes.id, { onDelete: "cascade" }),
    reviewerId: text("reviewer_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    classId: integer("class_id").notNull().references(() => labelClasses.id, { onDelete: "cascade" }),
    reason: text("reason").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("rulings_reviewer_id_idx").on(t.reviewerId), index("rulings_class_id_idx").on(t.classId)],
);

// ---------- Engine state, computed reports, editions, audit ----------

export const knnState = pgTable("knn_state", {
  projectId: integer("project_id").primaryKey().references(() => projects.id, { onDelete: "cascade" }),
  version: bigint("version", { mode: "number" }).notNull().default(1),
  settingsHash: text("settings_hash").notNull().default(""),
  preprocessor: jsonb("preprocessor").$type<unknown>(),
  labelsSincePoolRank: integer("labels_since_pool_rank").notNull().default(0),
  updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
});

/**
 * The change log behind knn_state.version: one row per item whose vote a transaction changed. The row is written
 * without a version; a deferred trigger (drizzle/0005) gives it the project's next version at commit, under the
 * knn_state row lock, so versions follow commit order and a process at version v reads exactly the rows above v.
 * Old rows are pruned as versions advance; a process that finds a gap rebuilds its index.
 */
export const knnChanges = pgTable(
  "knn_changes",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    itemId: integer("item_id").notNull(),
    version: bigint("version", { mode: "number" }),
  },
  (t) => [index("knn_changes_project_version_idx").on(t.projectId, t.version)],
);

export const reports = pgTable(
  "reports",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    kind: text("kind").$type<"agreement" | "tuning" | "doubts" | "map">().notNull(),
    status: jobStatusEnum("status").notNull().default("pending"),
    progress: real("progress").notNull().default(0),
    params: jsonb("params").$type<Record<string, unknown>>().notNull().default({}),
    result: jsonb("result").$type<unknown>(),
    knnVersion: bigint("knn_version", { mode: "number" }),
    message: text("message"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    finishedAt: timestamp("finished_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [index("reports_project_kind_idx").on(t.projectId, t.kind, t.createdAt), index("reports_created_by_idx").on(t.createdBy)],
);

export const editions = pgTable(
  "editions",
  {
    id: serial("id").primaryKey(),
    projectId: integer("project_id").notNull().references(() => projects.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    status: jobStatusEnum("status").notNull().default("pending"),
    options: jsonb("options").$type<Record<string, unknown>>().notNull().default({}),
    manifest: jsonb("manifest").$type<Record<string, unknown> | null>(),
    objectKeys: jsonb("object_keys").$type<Record<string, string> | null>(),
    message: text("message"),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    publishedAt: timestamp("published_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [uniqueIndex("editions_project_number_idx").on(t.projectId, t.number), index("editions_created_by_idx").on(t.createdBy)],
);

export const auditLog = pgTable(
  "audit_log",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    projectId: integer("project_id").references(() => projects.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    targetType: text("target_type").notNull(),
    targetId: text("target_id"),
    before: jsonb("before").$type<unknown>(),
    after: jsonb("after").$type<unknown>(),
    at: timestamp("at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [
    index("audit_log_project_at_idx").on(t.projectId, t.at),
    index("audit_log_actor_idx").on(t.actorId, t.at),
    index("audit_log_action_idx").on(t.action, t.at),
  ],
);

/** Sign-in and token rate limits (rate-limiter-flexible's RateLimiterPostgres layout). */
export const rateLimits = pgTable("rate_limits", {
  key: varchar("key", { length: 255 }).primaryKey(),
  points: integer("points").notNull().default(0),
  expire: bigint("expire", { mode: "number" }),
});

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Project = typeof projects.$inferSelect;
export type NewProject = typeof projects.$inferInsert;
export type ProjectMember = typeof projectMembers.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type LabelClass = typeof labelClasses.$inferSelect;
export type NewLabelClass = typeof labelClasses.$inferInsert;
export type Upload = typeof uploads.$inferSelect;
export type Import = typeof imports.$inferSelect;
export type Item = typeof items.$inferSelect;
export type NewItem = typeof items.$inferInsert;
export type Assignment = typeof assignments.$inferSelect;
export type Label = typeof labels.$inferSelect;
export type NewLabel = typeof labels.$inferInsert;
export type ItemFlag = typeof itemFlags.$inferSelect;
export type Dispute = typeof disputes.$inferSelect;
export type Ruling = typeof rulings.$inferSelect;
export type KnnState = typeof knnState.$inferSelect;
export type Report = typeof reports.$inferSelect;
export type Edition = typeof editions.$inferSelect;
export type AuditEntry = typeof auditLog.$inferSelect;
export type ProjectRole = (typeof roleEnum.enumValues)[number];
export type ItemStatus = (typeof itemStatusEnum.enumValues)[number];

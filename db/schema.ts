// The one schema: tables plus the row types Drizzle infers from them.
// Quantities stored in SI base units, with the unit in the column name.
import { sql } from "drizzle-orm";
import {
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
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
// The engine's types for the JSON columns (types only: db/ takes no behaviour from lib/).
import type { CandidateDetail, Choice, PlanChoice, PlanMetrics, Requirement } from "@/lib/design";
import type { ProfileSummary } from "@/lib/design/profile";

export const roleEnum = pgEnum("role", ["owner", "designer", "reviewer", "maker"]);
export const designStatusEnum = pgEnum("design_status", ["draft", "in-review", "approved", "returned"]);
export const verdictEnum = pgEnum("verdict", ["approve", "return", "comment"]);

const bytea = customType<{ data: Uint8Array; driverData: Uint8Array }>({
  dataType: () => "bytea",
});

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash").notNull(),
    // Put in the session token at sign-in and compared on every request: raising it ends every
    // session of the user (sign-out, password change, removal from a team).
    sessionVersion: integer("session_version").notNull().default(0),

    // Which review mail the person wants (the /account page); all on by default.
    mailOnSubmitted: boolean("mail_on_submitted").notNull().default(true),
    mailOnReturned: boolean("mail_on_returned").notNull().default(true),
    mailOnApproved: boolean("mail_on_approved").notNull().default(true),
    mailOnComments: boolean("mail_on_comments").notNull().default(true),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(sql`lower(${t.email})`)],
);

export const teams = pgTable("teams", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

// The role lives here and only here.
export const memberships = pgTable(
  "memberships",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("memberships_team_user_unique").on(t.teamId, t.userId)],
);

export const auditEvents = pgTable(
  "audit_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    targetType: text("target_type"),
    targetId: text("target_id"),
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_events_team_at").on(t.teamId, t.at), index("audit_events_target").on(t.targetType, t.targetId)],
);

export const designs = pgTable(
  "designs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    project: text("project"),
    status: designStatusEnum("status").notNull().default("draft"),
    // Mirrors the newest revision number so PATCH can compare-and-set in one UPDATE.
    revision: integer("revision").notNull().default(1),
    createdBy: uuid("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  // The designs list pages by keyset on (updated_at desc, id desc) within a team, optionally one status.
  (t) => [
    index("designs_team").on(t.teamId),
    // Ascending, read backwards: `order by updated_at desc, id desc` is NULLS FIRST, which an index
    // declared DESC (NULLS LAST) would not serve.
    index("designs_team_updated").on(t.teamId, t.updatedAt, t.id),
    index("designs_team_status_updated").on(t.teamId, t.status, t.updatedAt, t.id),
    // Search (`q`) matches a substring of the name or the project, case-insensitively (ILIKE
    // '%q%'): a btree cannot serve that, trigram GIN indexes can (pg_trgm; the migration creates
    // the extension, and db/client.ts loads it into PGlite). fastupdate off: a GIN index otherwise
    // queues new rows in a pending list that every search reads in full until a vacuum merges it,
    // and PGlite never vacuums. On the scale team the whole project index sat in that list and a
    // rare search took 30+ ms instead of 0.3 ms. Designs are written far less often than searched.
    index("designs_name_trgm").using("gin", t.name.op("gin_trgm_ops")).with({ fastupdate: false }),
    index("designs_project_trgm").using("gin", t.project.op("gin_trgm_ops")).with({ fastupdate: false }),
  ],
);

// The first answer to a request sent with an Idempotency-Key (API v2), kept 24 h per user, key and
// route; claimed in the same transaction as the write it guards, so a repeat creates nothing.
export const idempotencyKeys = pgTable(
  "idempotency_keys",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    scope: text("scope").notNull(),
    key: text("key").notNull(),
    response: jsonb("response").$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("idempotency_keys_user_scope_key").on(t.userId, t.scope, t.key)],
);

// Immutable: a save writes a new row, never updates one.
export const designRevisions = pgTable(
  "design_revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    designId: uuid("design_id")
      .notNull()
      .references(() => designs.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    name: text("name").notNull(),
    requirement: jsonb("requirement").$type<Requirement>().notNull(),
    // Exactly one of the two: a single shunt and gain, or a range plan (the check below).
    choice: jsonb("choice").$type<Choice>(),
    plan: jsonb("plan").$type<PlanChoice>(),
    // The engine's figures of whichever is set: a pair's, or { ranges: [...] } for a plan.
    metrics: jsonb("metrics").$type<CandidateDetail | PlanMetrics>().notNull(),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("design_revisions_design_revision").on(t.designId, t.revision),
    check("design_revisions_choice_or_plan", sql`(${t.choice} is null) <> (${t.plan} is null)`),
  ],
);

export const reviews = pgTable(
  "reviews",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    designId: uuid("design_id")
      .notNull()
      .references(() => designs.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id),
    verdict: verdictEnum("verdict").notNull(),
    body: text("body").notNull(),
    parentId: uuid("parent_id"),
    createdAt: createdAt(),
  },
  (t) => [index("reviews_design").on(t.designId, t.revision)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    // Only a hash of the single-use token is kept.
    tokenHash: text("token_hash").notNull(),
    invitedBy: uuid("invited_by")
      .notNull()
      .references(() => users.id),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("invitations_token_hash").on(t.tokenHash)],
);

// Messages kept by the built-in outbox (only used when SMTP_URL is unset). `team_id` is the team the
// mail was sent for, set by the sender (never read back from the message text); null on rows stored
// before the column existed, which no outbox shows.
export const mailMessages = pgTable(
  "mail_messages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    to: text("to").notNull(),
    from: text("from").notNull(),
    subject: text("subject").notNull(),
    text: text("text").notNull(),
    raw: text("raw").notNull(),
    sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_messages_team_sent").on(t.teamId, t.sentAt)],
);

// Failed sign-ins counted per bucket ("pair:<e-mail> <address>" or "address:<address>") in a fixed
// window, so throttling holds across restarts and across processes sharing one database.
export const signInFailures = pgTable("sign_in_failures", {
  bucket: text("bucket").primaryKey(),
  failures: integer("failures").notNull(),
  windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull(),
});

// A measured current recording; samples kept as little-endian Float64 arrays.
export const profiles = pgTable(
  "profiles",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    designId: uuid("design_id")
      .notNull()
      .references(() => designs.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    fileName: text("file_name").notNull(),
    samples: integer("samples").notNull(),
    timesS: bytea("times_s").notNull(),
    currentsA: bytea("currents_a").notNull(),
    summary: jsonb("summary").$type<ProfileSummary>().notNull(),
    uploadedBy: uuid("uploaded_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [index("profiles_design").on(t.designId)],
);

export const libraryAmplifiers = pgTable(
  "library_amplifiers",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    gainMode: text("gain_mode").$type<"fixed" | "resistor-set">().notNull(),
    gains: jsonb("gains").$type<number[]>().notNull(),
    offsetV: doublePrecision("offset_v").notNull(),
    offsetDriftVPerK: doublePrecision("offset_drift_v_per_k").notNull(),
    gainErrorFraction: doublePrecision("gain_error_fraction").notNull(),
    gainDriftPerK: doublePrecision("gain_drift_per_k").notNull(),
    biasCurrentA: doublePrecision("bias_current_a").notNull(),
    noiseDensityVPerRtHz: doublePrecision("noise_density_v_per_rt_hz").notNull(),
    gbwHz: doublePrecision("gbw_hz").notNull(),
    swingLowV: doublePrecision("swing_low_v").notNull(),
    swingHighV: doublePrecision("swing_high_v").notNull(),
    cmrrDb: doublePrecision("cmrr_db").notNull(),
    supplyMinV: doublePrecision("supply_min_v").notNull(),
    supplyMaxV: doublePrecision("supply_max_v").notNull(),
    topology: text("topology")
      .$type<"current-sense" | "difference" | "non-inverting" | "instrumentation">()
      .notNull()
      .default("current-sense"),
    /** Null: the topology's usual input common-mode range. */
    commonModeMinV: doublePrecision("common_mode_min_v"),
    commonModeMaxV: doublePrecision("common_mode_max_v"),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("library_amplifiers_team_name").on(t.teamId, t.name)],
);

export const libraryShunts = pgTable(
  "library_shunts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    series: text("series").notNull(),
    minOhms: doublePrecision("min_ohms").notNull(),
    maxOhms: doublePrecision("max_ohms").notNull(),
    toleranceFraction: doublePrecision("tolerance_fraction").notNull(),
    tempcoPerK: doublePrecision("tempco_per_k").notNull(),
    ratingsW: jsonb("ratings_w").$type<number[]>().notNull(),
    fourTerminal: boolean("four_terminal").notNull().default(false),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("library_shunts_team_name").on(t.teamId, t.name)],
);

// Readouts (issue 14): an ADC or a meter range under the requirement's readout names (API.md v2),
// the reference and accuracy groups as the JSON objects the API reads and writes.
export const libraryAdcs = pgTable(
  "library_adcs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    bits: integer("bits").notNull(),
    fullScale: doublePrecision("full_scale_v").notNull(),
    sampleRateHz: doublePrecision("sample_rate_hz").notNull(),
    reference: jsonb("reference").$type<{ tolerance: number; tempco: number }>().notNull(),
    offsetLsb: doublePrecision("offset_lsb").notNull(),
    gainError: doublePrecision("gain_error").notNull(),
    inlLsb: doublePrecision("inl_lsb").notNull(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("library_adcs_team_name").on(t.teamId, t.name)],
);

export const libraryMeters = pgTable(
  "library_meters",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    fullScale: doublePrecision("full_scale_v").notNull(),
    counts: integer("counts").notNull(),
    accuracy: jsonb("accuracy").$type<{ percentOfReading: number; digits: number }>().notNull(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("library_meters_team_name").on(t.teamId, t.name)],
);

// Built units (the maker's loop): one row per unit built from an approved revision, its bench
// readings in their own rows. Judgements are worked out by the engine on read, never stored.
export const builtUnits = pgTable(
  "built_units",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    designId: uuid("design_id")
      .notNull()
      .references(() => designs.id, { onDelete: "cascade" }),
    // The approved revision the unit was built from (its bench check judges the readings).
    revision: integer("revision").notNull(),
    serial: text("serial").notNull(),
    builtOn: date("built_on", { mode: "string" }).notNull(),
    recordedBy: uuid("recorded_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("built_units_design_serial").on(t.designId, sql`lower(${t.serial})`),
    index("built_units_design").on(t.designId),
  ],
);

export const unitReadings = pgTable(
  "unit_readings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    unitId: uuid("unit_id")
      .notNull()
      .references(() => builtUnits.id, { onDelete: "cascade" }),
    // Which range's bench check (0 on a single-pair design; one set per range on a plan).
    rangeIndex: integer("range_index").notNull().default(0),
    // The test point's place in that bench check.
    pointIndex: integer("point_index").notNull(),
    currentA: doublePrecision("current_a").notNull(),
    outputV: doublePrecision("output_v").notNull(),
  },
  (t) => [uniqueIndex("unit_readings_unit_point").on(t.unitId, t.rangeIndex, t.pointIndex)],
);

export const tokenAccessEnum = pgEnum("token_access", ["read", "write"]);

// Personal API tokens: a script acts as its owner, in the team the token was made in, never above
// the owner's current role there. Only the SHA-256 of the secret is kept (the secret is 32 random
// bytes, so a fast hash is enough: there is nothing to guess).
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    access: tokenAccessEnum("access").notNull(),
    secretHash: text("secret_hash").notNull(),
    /** The first characters of the secret, to tell tokens apart in a list (too few to guess from). */
    hint: text("hint").notNull(),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("api_tokens_secret_hash").on(t.secretHash), index("api_tokens_user").on(t.userId)],
);

export type User = typeof users.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type TokenAccess = (typeof tokenAccessEnum.enumValues)[number];
export type Team = typeof teams.$inferSelect;
export type Membership = typeof memberships.$inferSelect;
export type Role = (typeof roleEnum.enumValues)[number];
export type DesignStatus = (typeof designStatusEnum.enumValues)[number];
export type Verdict = (typeof verdictEnum.enumValues)[number];
export type AuditEvent = typeof auditEvents.$inferSelect;
export type Design = typeof designs.$inferSelect;
export type DesignRevision = typeof designRevisions.$inferSelect;
export type Review = typeof reviews.$inferSelect;
export type Invitation = typeof invitations.$inferSelect;
export type MailMessage = typeof mailMessages.$inferSelect;
export type Profile = typeof profiles.$inferSelect;
export type LibraryAmplifier = typeof libraryAmplifiers.$inferSelect;
export type LibraryShunt = typeof libraryShunts.$inferSelect;
export type LibraryAdc = typeof libraryAdcs.$inferSelect;
export type LibraryMeter = typeof libraryMeters.$inferSelect;
export type BuiltUnit = typeof builtUnits.$inferSelect;
export type UnitReadingRow = typeof unitReadings.$inferSelect;
export const roles = roleEnum.enumValues;

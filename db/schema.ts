// The one schema: tables plus the row types Drizzle infers from them.
// Quantities stored in SI base units, with the unit in the column name.
import { sql } from "drizzle-orm";
import {
  boolean,
  customType,
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
import type { CandidateDetail, Choice, Requirement } from "@/lib/design";
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
  (t) => [index("designs_team").on(t.teamId)],
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
    choice: jsonb("choice").$type<Choice>().notNull(),
    metrics: jsonb("metrics").$type<CandidateDetail>().notNull(),
    authorId: uuid("author_id")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("design_revisions_design_revision").on(t.designId, t.revision)],
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

// Messages received by the built-in mail catcher (only used when SMTP_URL is unset).
export const mailMessages = pgTable("mail_messages", {
  id: uuid("id").primaryKey().defaultRandom(),
  to: text("to").notNull(),
  from: text("from").notNull(),
  subject: text("subject").notNull(),
  text: text("text").notNull(),
  raw: text("raw").notNull(),
  sentAt: timestamp("sent_at", { withTimezone: true }).notNull().defaultNow(),
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

export type User = typeof users.$inferSelect;
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
export const roles = roleEnum.enumValues;

/// Ringside's relational schema. Migrations in `drizzle/` are generated from this file
/// with `npm run db:generate`; never edit a committed migration.
import { sql } from "drizzle-orm";
import {
  type AnyPgColumn,
  bigint,
  boolean,
  check,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";

export const siteRole = pgEnum("site_role", ["admin", "member"]);
export const teamRole = pgEnum("team_role", ["lead", "member", "guest"]);
/// Who sees a session besides its owner and its shares: nobody else, or its team. A published
/// read-only link is separate (`shareToken` not null) and never opens the session to the team.
export const visibility = pgEnum("visibility", ["private", "team"]);
/// `interrupted`: the server running the cell stopped (or lost it) before it finished; the
/// cell keeps what had streamed.
export const cellStatus = pgEnum("cell_status", ["pending", "running", "done", "error", "cancelled", "interrupted"]);
export const shareRole = pgEnum("share_role", ["viewer", "editor"]);
export const invitationStatus = pgEnum("invitation_status", ["pending", "accepted", "revoked", "expired"]);

/// Experiments (notation.md §11): the whole sweep's state, and each row's status.
export const experimentStatus = pgEnum("experiment_status", ["queued", "running", "paused", "done", "cancelled"]);
export const experimentRowStatus = pgEnum("experiment_row_status", ["ok", "error", "limit", "cancelled"]);
export const uploadFormat = pgEnum("upload_format", ["text", "json"]);

export type SiteRole = (typeof siteRole.enumValues)[number];
export type TeamRole = (typeof teamRole.enumValues)[number];
export type Visibility = (typeof visibility.enumValues)[number];
export type CellStatus = (typeof cellStatus.enumValues)[number];
export type ShareRole = (typeof shareRole.enumValues)[number];

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // Stored lower-cased by the application; the check keeps every writer honest.
    email: text("email").notNull(),
    displayName: text("display_name").notNull(),
    passwordHash: text("password_hash").notNull(),
    siteRole: siteRole("site_role").notNull().default("member"),
    /// When the owner of the address confirmed it through the mailed link; null until then.
    /// The default marks accounts that existed before verification (and accounts made by
    /// administrators' scripts) as confirmed; sign-up sets null explicitly.
    emailVerifiedAt: timestamp("email_verified_at", { withTimezone: true }).defaultNow(),
    /// Carried in every sign-in token and compared on each request; signing out increments
    /// it, so every token issued before stops working at once.
    sessionVersion: integer("session_version").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("users_email_unique").on(t.email),
    check("users_email_lower", sql`${t.email} = lower(${t.email})`),
    check("users_display_name_present", sql`length(btrim(${t.displayName})) > 0`),
  ],
);

export const teams = pgTable("teams", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  name: text("name").notNull(),
  description: text("description").notNull().default(""),
  createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
  createdAt: createdAt(),
});

export const memberships = pgTable(
  "memberships",
  {
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: teamRole("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index("memberships_user_idx").on(t.userId)],
);

/// A Ringside session: a transcript of cells with its named objects (not a sign-in session;
/// sign-in uses JWT cookies and keeps no table).
export const sessions = pgTable(
  "sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    title: text("title").notNull(),
    ownerId: uuid("owner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "set null" }),
    visibility: visibility("visibility").notNull().default("private"),
    /// the read-only link's token while a link is published, else null
    shareToken: text("share_token").unique(),
    /// true while the title is the placeholder given to a session created without one; the
    /// first definition it stores then becomes its title (issue 18), and a rename clears it
    autoTitle: boolean("auto_title").notNull().default(false),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("sessions_owner_idx").on(t.ownerId),
    index("sessions_team_idx").on(t.teamId),
    // (renamed from sessions_team_visibility_has_team so the enum could be rebuilt under it)
    check("sessions_team_visible_needs_team", sql`${t.visibility} <> 'team' OR ${t.teamId} IS NOT NULL`),
  ],
);

export const cells = pgTable(
  "cells",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => sessions.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    source: text("source").notNull(),
    status: cellStatus("status").notNull().default("pending"),
    result: jsonb("result"),
    error: jsonb("error"),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    durationMs: integer("duration_ms"),
    engineVersion: text("engine_version"),
    /// the server process running the cell ("host/pid/boot nonce") and its last sign of life
    serverId: text("server_id"),
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    unique("cells_session_position_unique").on(t.sessionId, t.position),
    index("cells_running_idx")
      .on(t.status)
      .where(sql`${t.status} = 'running'`),
    check("cells_position_nonnegative", sql`${t.position} >= 0`),
    check("cells_duration_nonnegative", sql`${t.durationMs} IS NULL OR ${t.durationMs} >= 0`),
  ],
);

export const namedObjects = pgTable(
  "named_objects",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => sessions.id, { onDelete: "cascade" }),
    /// who defined it: the user whose cell bound the name last (or who imported the copy);
    /// redefining another person's name needs an explicit confirmation (issue 18)
    ownerId: uuid("owner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    type: text("type").notNull(),
    value: jsonb("value").notNull(),
    /// the text of the statement that defined it (notation.md §2)
    source: text("source").notNull().default(""),
    sourceCellId: uuid("source_cell_id").references(() => cells.id, { onDelete: "set null" }),
    /// for a copy imported from a shared object or a JSON export: where it came from
    /// ({kind, objectId?, sessionId?, sessionTitle, name, ownerName?, importedAt}); null otherwise
    origin: jsonb("origin"),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("named_objects_session_name_unique").on(t.sessionId, t.name)],
);

/// A grant of a role on one session or one named object to one user or one team.
export const shares = pgTable(
  "shares",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id").references(() => sessions.id, { onDelete: "cascade" }),
    objectId: uuid("object_id").references(() => namedObjects.id, { onDelete: "cascade" }),
    userId: uuid("user_id").references(() => users.id, { onDelete: "cascade" }),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    /// A share to an address with no confirmed account yet: it grants nothing until an
    /// account confirms this address, when it becomes a share to that user. Kept so that
    /// sharing answers alike whether or not the address has an account.
    email: text("email"),
    role: shareRole("role").notNull(),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [
    check("shares_one_target", sql`num_nonnulls(${t.sessionId}, ${t.objectId}) = 1`),
    check("shares_one_grantee_or_address", sql`num_nonnulls(${t.userId}, ${t.teamId}, ${t.email}) = 1`),
    check("shares_email_lower", sql`${t.email} = lower(${t.email})`),
    unique("shares_target_grantee_address_unique").on(t.sessionId, t.objectId, t.userId, t.teamId, t.email).nullsNotDistinct(),
    index("shares_email_idx").on(t.email),
    index("shares_user_idx").on(t.userId),
    index("shares_team_idx").on(t.teamId),
  ],
);

/// An e-mailed invitation to join a team. Only the SHA-256 of the token is stored.
export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: teamRole("role").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    status: invitationStatus("status").notNull().default("pending"),
    invitedBy: uuid("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_team_idx").on(t.teamId), check("invitations_email_lower", sql`${t.email} = lower(${t.email})`)],
);

/// Security-relevant events. `details` never holds a password or a token.
export const auditLog = pgTable(
  "audit_log",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    event: text("event").notNull(),
    userId: uuid("user_id").references(() => users.id, { onDelete: "set null" }),
    email: text("email"),
    address: text("address"),
    details: jsonb("details").notNull().default({}),
  },
  (t) => [index("audit_log_at_idx").on(t.at), index("audit_log_event_idx").on(t.event, t.at)],
);

/// One row per sign-in attempt; the rate limiter counts recent failures per account and
/// per client address here, so every web server shares the same counts.
/// A pending confirmation of a new account's e-mail address: the SHA-256 of the mailed
/// token (the token itself is never stored), valid until `expiresAt`.
export const emailVerifications = pgTable(
  "email_verifications",
  {
    tokenHash: text("token_hash").primaryKey(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("email_verifications_user_idx").on(t.userId)],
);

export const signInAttempts = pgTable(
  "sign_in_attempts",
  {
    id: bigint("id", { mode: "number" }).primaryKey().generatedAlwaysAsIdentity(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
    email: text("email").notNull(),
    address: text("address").notNull(),
    succeeded: boolean("succeeded").notNull(),
  },
  (t) => [index("sign_in_attempts_email_idx").on(t.email, t.at), index("sign_in_attempts_address_idx").on(t.address, t.at)],
);

/// A sweep run as a durable background job: one pg-boss job per member (lib/experiments).
/// Everything needed to run it again is stored: the program text, the family (definition
/// with seeds, and every member's §9 JSON), the probe (§9 Function JSON with its captures),
/// the engine version and the limits. Access follows the session it belongs to.
export const experiments = pgTable(
  "experiments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => sessions.id, { onDelete: "cascade" }),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    status: experimentStatus("status").notNull().default("queued"),
    /// the program the sweep came from (a cell's text, or the probe over an uploaded family)
    program: text("program").notNull(),
    familyDefinition: text("family_definition").notNull(),
    /// the Family's §9 JSON (every member)
    family: jsonb("family").notNull(),
    /// one label per member, in member order
    labels: jsonb("labels").notNull(),
    probeText: text("probe_text").notNull(),
    /// the probe's §9 Function JSON
    probe: jsonb("probe").notNull(),
    engineVersion: text("engine_version").notNull(),
    /// {timeLimitMs, heapLimitMb} applied to every member
    limits: jsonb("limits").notNull(),
    total: integer("total").notNull(),
    /// the probe's field names in the order written, from the first ok row (null before it)
    columns: jsonb("columns"),
    sourceCellId: uuid("source_cell_id").references(() => cells.id, { onDelete: "set null" }),
    uploadId: uuid("upload_id").references(() => uploads.id, { onDelete: "set null" }),
    /// the experiment this one runs again ("run again"), if any
    rerunOf: uuid("rerun_of").references((): AnyPgColumn => experiments.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [index("experiments_session_idx").on(t.sessionId, t.createdAt), check("experiments_total_nonnegative", sql`${t.total} >= 0`)],
);

/// One member's row. The primary key (experiment, member) makes a row exist at most once;
/// workers insert with ON CONFLICT DO NOTHING, one transaction per row.
export const experimentRows = pgTable(
  "experiment_rows",
  {
    experimentId: uuid("experiment_id")
      .notNull()
      .references(() => experiments.id, { onDelete: "cascade" }),
    memberIndex: integer("member_index").notNull(),
    status: experimentRowStatus("status").notNull(),
    /// the probe's Record as {name: §9 value}; the column order is experiments.columns
    fields: jsonb("fields").notNull(),
    message: text("message"),
    durationMs: integer("duration_ms").notNull(),
    /// which worker process ran it ("host:pid:label")
    worker: text("worker").notNull(),
    finishedAt: timestamp("finished_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.experimentId, t.memberIndex] }),
    check("experiment_rows_index_nonnegative", sql`${t.memberIndex} >= 0`),
    check("experiment_rows_duration_nonnegative", sql`${t.durationMs} >= 0`),
  ],
);

/// A family uploaded as a file (one ideal per line in the notation, or JSON lists of
/// generators), stored only when every line was valid.
export const uploads = pgTable("uploads", {
  id: uuid("id").primaryKey().defaultRandom(),
  sessionId: uuid("session_id")
    .notNull()
    .references(() => sessions.id, { onDelete: "cascade" }),
  createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
  name: text("name").notNull(),
  format: uploadFormat("format").notNull(),
  content: text("content").notNull(),
  /// the Family's §9 JSON
  family: jsonb("family").notNull(),
  length: integer("length").notNull(),
  createdAt: createdAt(),
});

import { sql } from "drizzle-orm";
import { index, integer, primaryKey, sqliteTable, text } from "drizzle-orm/sqlite-core";

export const ROLES = ["admin", "engineer", "technician", "owner"] as const;
export type Role = (typeof ROLES)[number];

const createdAt = () =>
  integer("created_at", { mode: "timestamp_ms" })
    .notNull()
    .default(sql`(cast(unixepoch('subsec') * 1000 as integer))`);

export const users = sqliteTable("users", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  role: text("role", { enum: ROLES }).notNull(),
  passwordHash: text("password_hash").notNull(),
  active: integer("active", { mode: "boolean" }).notNull().default(true),
  createdAt: createdAt(),
});

export const structures = sqliteTable("structures", {
  id: integer("id").primaryKey({ autoIncrement: true }),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  location: text("location"),
  timezone: text("timezone").notNull().default("UTC"),
  description: text("description"),
  createdAt: createdAt(),
});

export const structureMembers = sqliteTable(
  "structure_members",
  {
    structureId: integer("structure_id")
      .notNull()
      .references(() => structures.id, { onDelete: "cascade" }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.structureId, t.userId] }), index("structure_members_user").on(t.userId)],
);

export const TOKEN_KINDS = ["user", "logger"] as const;
export type TokenKind = (typeof TOKEN_KINDS)[number];

export const apiTokens = sqliteTable(
  "api_tokens",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    name: text("name").notNull(),
    kind: text("kind", { enum: TOKEN_KINDS }).notNull(),
    /** The user a user token acts as; null for logger tokens. */
    userId: integer("user_id").references(() => users.id, { onDelete: "cascade" }),
    /** The one structure a logger token may ingest into; null for user tokens. */
    structureId: integer("structure_id").references(() => structures.id, { onDelete: "cascade" }),
    /** SHA-256 of the token: the token itself is shown once and never stored. */
    tokenHash: text("token_hash").notNull().unique(),
    /** First characters of the token, so people can tell their tokens apart in lists. */
    hint: text("hint").notNull(),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    lastUsedAt: integer("last_used_at", { mode: "timestamp_ms" }),
    revokedAt: integer("revoked_at", { mode: "timestamp_ms" }),
  },
  (t) => [index("api_tokens_user").on(t.userId), index("api_tokens_structure").on(t.structureId)],
);

export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    at: createdAt(),
    actorId: integer("actor_id").references(() => users.id, { onDelete: "set null" }),
    /** Who acted, kept as text so the record survives the user's removal (e-mail or token name). */
    actorLabel: text("actor_label").notNull(),
    action: text("action").notNull(),
    entityType: text("entity_type").notNull(),
    entityKey: text("entity_key").notNull(),
    structureId: integer("structure_id").references(() => structures.id, { onDelete: "set null" }),
    before: text("before", { mode: "json" }),
    after: text("after", { mode: "json" }),
  },
  (t) => [index("audit_log_entity").on(t.entityType, t.entityKey), index("audit_log_structure").on(t.structureId)],
);

/** Failed sign-ins per e-mail address, used to slow down password guessing. */
export const signInFailures = sqliteTable("sign_in_failures", {
  emailKey: text("email_key").primaryKey(),
  failures: integer("failures").notNull(),
  lastFailureAt: integer("last_failure_at", { mode: "timestamp_ms" }).notNull(),
});

export type User = typeof users.$inferSelect;
export type Structure = typeof structures.$inferSelect;
export type ApiToken = typeof apiTokens.$inferSelect;
export type AuditEntry = typeof auditLog.$inferSelect;


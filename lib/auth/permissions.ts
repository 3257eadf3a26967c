import type { Role } from "@/db/schema";

/** Everything someone may ask to do. Structure-scoped actions also need membership (admins excepted). */
export const ACTIONS = {
  "structure:view": "See a structure, its gauges, data and alerts",
  "structure:create": "Create a structure",
  "gauge:register": "Register and edit gauges, photos and drawings",
  "zero:record": "Record a zero (reference) reading",
  "shunt-check:record": "Record shunt-calibration checks of a gauge's bridge",
  "readings:ingest": "Send or upload readings",
  "limits:edit": "Change limits",
  "thermal-model:edit": "Fit, save and remove gauges' thermal models",
  "alert:acknowledge": "Acknowledge and clear alerts",
  "load-test:record": "Record load tests and their predicted strains",
  "field-record:add": "Add calibration certificates and site visits",
  "token:manage": "Create and revoke logger tokens of the structure",
  "audit:view": "Read the audit trail",
  "users:manage": "Add, change and deactivate users",
  "members:manage": "Add and remove structure members",
  "mail:read": "Read the mail caught by the local mail server",
} as const;

export type Action = keyof typeof ACTIONS;

/** Actions that concern one structure, as opposed to the whole installation. */
const STRUCTURE_SCOPED: ReadonlySet<Action> = new Set<Action>([
  "structure:view",
  "gauge:register",
  "zero:record",
  "shunt-check:record",
  "readings:ingest",
  "limits:edit",
  "thermal-model:edit",
  "alert:acknowledge",
  "load-test:record",
  "field-record:add",
  "token:manage",
  "audit:view",
]);

const EVERY_ACTION = Object.keys(ACTIONS) as Action[];

/** The permission matrix. README.md prints it; tests/unit/permissions.test.ts checks it cell by cell. */
export const PERMISSIONS: Record<Role, ReadonlySet<Action>> = {
  admin: new Set(EVERY_ACTION),
  engineer: new Set<Action>([
    "structure:view",
    "structure:create",
    "gauge:register",
    "zero:record",
    "shunt-check:record",
    "readings:ingest",
    "limits:edit",
    "thermal-model:edit",
    "alert:acknowledge",
    "load-test:record",
    "field-record:add",
    "token:manage",
    "audit:view",
  ]),
  technician: new Set<Action>(["structure:view", "gauge:register", "zero:record", "shunt-check:record", "readings:ingest", "field-record:add"]),
  owner: new Set<Action>(["structure:view"]),
};

export function roleAllows(role: Role, action: Action): boolean {
  return PERMISSIONS[role].has(action);
}

export function isStructureScoped(action: Action): boolean {
  return STRUCTURE_SCOPED.has(action);
}

/** Admins see every structure; everyone else only those they are members of. */
export function seesAllStructures(role: Role): boolean {
  return role === "admin";
}

/** Roles whose members get a structure's alert e-mails (immediately or as a daily digest). */
export const ALERT_MAIL_ROLES = ["owner", "engineer"] as const satisfies readonly Role[];

export function receivesAlertMail(role: Role): boolean {
  return (ALERT_MAIL_ROLES as readonly Role[]).includes(role);
}

/** Roles whose members are reminded of the structure's calibration certificates before they expire: those who keep the instruments. */
export const CERTIFICATE_REMINDER_ROLES = ["technician", "engineer"] as const satisfies readonly Role[];

/**
 * Whether a role's sensor-fault e-mails go to the digest when the member has not chosen: an owner's
 * do (a sensor fault asks the engineer to act, not the owner); everyone else's arrive as they happen.
 */
export function sensorMailDigestByDefault(role: Role): boolean {
  return role === "owner";
}

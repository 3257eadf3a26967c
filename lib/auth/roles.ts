/** The roles a person can have; pure, so forms in the browser can list them without the schema. */
export const ROLES = ["admin", "engineer", "technician", "owner"] as const;
export type Role = (typeof ROLES)[number];

/** The shortest password accepted; the hashing itself stays on the server (passwords.ts). */
export const MIN_PASSWORD_LENGTH = 8;

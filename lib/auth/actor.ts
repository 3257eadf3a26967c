import type { Role } from "@/db/schema";

/** A signed-in person, or a person acting through their API token. */
export type UserActor = { kind: "user"; id: number; email: string; name: string; role: Role };

/** A data logger acting through a token bound to one structure. */
export type LoggerActor = { kind: "logger"; tokenId: number; name: string; structureId: number };

export type Actor = UserActor | LoggerActor;

/** How the audit trail names whoever acted. */
export function actorLabel(actor: Actor): string {
  return actor.kind === "user" ? actor.email : `logger token "${actor.name}"`;
}

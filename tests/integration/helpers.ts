import { createStructure } from "@/lib/services/structures";
import { addMember } from "@/lib/services/memberships";
import { createToken } from "@/lib/services/tokens";
import { createUser, findUserByEmail } from "@/lib/services/users";
import type { Role } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";

export async function makeUser(role: Role, email = `${role}@test.example`): Promise<UserActor> {
  const user = await createUser(null, { email, name: `Test ${role}`, role, password: "correct-horse" });
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

export async function makeStructure(code: string, members: UserActor[] = []) {
  const structure = await createStructure(null, { code, name: `Structure ${code}`, timezone: "UTC" });
  for (const member of members) await addMember(null, member.email, code);
  return structure;
}

export async function userToken(email: string): Promise<string> {
  if (!(await findUserByEmail(email))) throw new Error(`no user ${email}`);
  return (await createToken(null, { kind: "user", email }, "test")).token;
}

export async function loggerToken(structureCode: string): Promise<string> {
  return (await createToken(null, { kind: "logger", structureCode }, "test logger")).token;
}

type Init = { method?: string; token?: string; body?: unknown; headers?: Record<string, string> };

/** A Request as a client would send it to /api/v1. */
export function apiRequest(path: string, init: Init = {}): Request {
  const headers: Record<string, string> = { ...init.headers };
  if (init.token) headers.authorization = `Bearer ${init.token}`;
  let body: string | undefined;
  if (init.body !== undefined) {
    body = typeof init.body === "string" ? init.body : JSON.stringify(init.body);
    headers["content-type"] ??= "application/json";
  }
  return new Request(`http://localhost/api/v1${path}`, { method: init.method ?? (body ? "POST" : "GET"), headers, body });
}

export const noParams = { params: Promise.resolve({}) };
export const params = <P>(value: P) => ({ params: Promise.resolve(value) });

const TEAM_ROLES = ["engineer", "technician", "owner"] as const;
type TeamRole = (typeof TEAM_ROLES)[number];

/** An engineer, a technician and an owner, all members of a new structure `code`, each with an API token. */
export async function makeTeam(code: string) {
  const users = {} as Record<TeamRole, UserActor>;
  const tokens = {} as Record<TeamRole, string>;
  for (const role of TEAM_ROLES) {
    users[role] = await makeUser(role);
    tokens[role] = await userToken(users[role].email);
  }
  await makeStructure(code, Object.values(users));
  return { users, tokens };
}

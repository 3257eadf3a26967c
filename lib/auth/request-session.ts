import "server-only";
import { getToken } from "next-auth/jwt";
import { NextRequest } from "next/server";
import type { UserActor } from "./actor";
import { userForSession } from "./session-claims";

/**
 * The signed-in user behind a browser's request to /api/v1 (the app's own pages fetch data there),
 * or null when the request carries no valid session. Cookies are read by the framework's parser,
 * which shrugs off malformed ones instead of throwing.
 */
export async function userForSessionCookie(request: Request): Promise<UserActor | null> {
  const { cookies } = request instanceof NextRequest ? request : new NextRequest(request.url, { headers: request.headers });
  if (!cookies.getAll().some(({ name }) => name.includes("next-auth.session-token"))) return null;
  const token = await getToken({ req: { cookies, headers: request.headers } as never, secret: process.env.NEXTAUTH_SECRET });
  return userForSession(token);
}

import { getToken } from "next-auth/jwt";
import { getUserById } from "@/lib/services/users";
import type { UserActor } from "./actor";

function cookiesOf(request: Request): Record<string, string> {
  const header = request.headers.get("cookie") ?? "";
  return Object.fromEntries(
    header
      .split(";")
      .map((part) => part.trim().split("="))
      .filter(([name]) => name)
      .map(([name, ...value]) => [name!, decodeURIComponent(value.join("="))]),
  );
}

/**
 * The signed-in user behind a browser's request to /api/v1 (the app's own pages fetch data there),
 * or null when the request carries no valid session. Deactivated accounts count as signed out.
 */
export async function userForSessionCookie(request: Request): Promise<UserActor | null> {
  const cookies = cookiesOf(request);
  if (!Object.keys(cookies).some((name) => name.includes("next-auth.session-token"))) return null;
  const token = await getToken({ req: { cookies, headers: request.headers } as never, secret: process.env.NEXTAUTH_SECRET });
  const id = Number(token?.sub);
  if (!Number.isInteger(id)) return null;
  const user = await getUserById(id);
  if (!user || !user.active) return null;
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

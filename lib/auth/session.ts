import "server-only";
import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import type { UserActor } from "./actor";
import { authOptions } from "./options";
import { userForSession } from "./session-claims";

/**
 * The signed-in user as the database knows them now: a deactivated account, a changed role or
 * an ended session takes effect on the next request, whatever the session cookie still says.
 */
export async function currentUser(): Promise<UserActor | null> {
  const session = await getServerSession(authOptions);
  const user = session?.user;
  return userForSession(user && { sub: user.id, sessionFormat: user.sessionFormat, sessionVersion: user.sessionVersion, sessionId: user.sessionId });
}

/** For pages: the signed-in user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<UserActor> {
  const user = await currentUser();
  if (!user) redirect("/signin");
  return user;
}

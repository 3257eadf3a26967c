import "server-only";
import { cache } from "react";
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

/**
 * For pages: the signed-in user, or a redirect to the sign-in page. Asked once per render of a
 * request (the layout and the page both ask): each asking decrypts and re-issues the session
 * cookie and reads the account twice. React's cache lasts one server render, so a server action,
 * which runs outside it, still reads the user afresh.
 */
export const requireUser = cache(async (): Promise<UserActor> => {
  const user = await currentUser();
  if (!user) redirect("/signin");
  return user;
});

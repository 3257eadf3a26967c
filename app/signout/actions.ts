"use server";

import { currentUser } from "@/lib/auth/session";
import { endEverySession } from "@/lib/services/users";

/** Ends every session of the signed-in user; the page then signs this browser out as usual. */
export async function signOutEverywhereAction(): Promise<void> {
  const user = await currentUser();
  if (user) await endEverySession(user);
}

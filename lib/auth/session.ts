import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import type { UserActor } from "./actor";
import { authOptions } from "./options";
import { getUserById } from "@/lib/services/users";

/**
 * The signed-in user as the database knows them now: a deactivated account or a changed
 * role takes effect on the next request, whatever the session cookie still says.
 */
export async function currentUser(): Promise<UserActor | null> {
  const session = await getServerSession(authOptions);
  const id = Number(session?.user?.id);
  if (!Number.isInteger(id)) return null;
  const user = await getUserById(id);
  if (!user || !user.active) return null;
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

/** For pages: the signed-in user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<UserActor> {
  const user = await currentUser();
  if (!user) redirect("/signin");
  return user;
}

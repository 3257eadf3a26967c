import type { Role } from "@/db/schema";

declare module "next-auth" {
  interface User {
    role: Role;
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; role: Role; sessionVersion: number; sessionId: string; name?: string | null; email?: string | null };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    role: Role;
    /** The user's session version when they signed in (users.session_version). */
    sessionVersion: number;
    /** Names this sign-in, so signing out can end it alone. */
    sessionId: string;
  }
}

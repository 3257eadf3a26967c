import type { Role } from "@/db/schema";

declare module "next-auth" {
  interface User {
    role: Role;
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; role: Role; sessionFormat: number | undefined; sessionVersion: number; sessionId: string; name?: string | null; email?: string | null };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    /** SESSION_FORMAT of the release that wrote the cookie; absent in cookies of format 1. */
    sessionFormat?: number;
    role: Role;
    /** The user's session version when they signed in (users.session_version). */
    sessionVersion: number;
    /** Names this sign-in, so signing out can end it alone. */
    sessionId: string;
  }
}

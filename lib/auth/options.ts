import "server-only";
import { randomUUID } from "node:crypto";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { endSession, SESSION_FORMAT } from "./session-claims";
import { clientAddressOf, verifyCredentials } from "./sign-in";

const SESSION_HOURS = 12;

/** What the sign-in form receives as `error` when the account or address is paused. */
export const SIGN_IN_LOCKED = "locked";

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_HOURS * 3600 },
  pages: { signIn: "/signin", signOut: "/signout", error: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, request) {
        if (!credentials?.email || !credentials.password) return null;
        const outcome = await verifyCredentials(credentials.email, credentials.password, clientAddressOf(request.headers ?? {}));
        if ("refused" in outcome) {
          if (outcome.refused === "locked") throw new Error(SIGN_IN_LOCKED);
          return null;
        }
        const { actor, sessionVersion } = outcome;
        return { id: String(actor.id), email: actor.email, name: actor.name, role: actor.role, sessionVersion };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.sessionFormat = SESSION_FORMAT;
        token.role = user.role;
        token.sessionVersion = user.sessionVersion;
        token.sessionId = randomUUID();
      }
      return token;
    },
    session({ session, token }) {
      if (session.user) {
        session.user.id = token.sub!;
        session.user.role = token.role;
        session.user.sessionFormat = token.sessionFormat;
        session.user.sessionVersion = token.sessionVersion;
        session.user.sessionId = token.sessionId;
      }
      return session;
    },
  },
  events: {
    async signOut({ token }) {
      if (token?.sessionId) await endSession(token.sessionId, new Date(Number(token.exp ?? 0) * 1000 || Date.now() + SESSION_HOURS * 3600_000));
    },
  },
};

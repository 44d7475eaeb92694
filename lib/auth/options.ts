/**
 * next-auth configuration: e-mail and password against our users table, JWT sessions
 * that carry the user id and roles. Pages and handlers still re-read the user from the
 * database (lib/auth/session.ts), so a disabled user or a removed role takes effect at once.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { getDb } from "@/db/index";
import { authorizeCredentials } from "./credentials";

export const SESSION_MAX_AGE_SECONDS = 12 * 60 * 60; // one observing night and a margin

function clientAddress(headers: Record<string, unknown> | undefined): string {
  const forwarded = headers?.["x-forwarded-for"];
  return typeof forwarded === "string" ? (forwarded.split(",")[0] ?? "").trim() : "local";
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  jwt: { maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/sign-in" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { type: "email" }, password: { type: "password" } },
      authorize(credentials, req) {
        return authorizeCredentials(getDb(), credentials, clientAddress(req?.headers));
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.roles = user.roles;
      }
      return token;
    },
    session({ session, token }) {
      if (session.user) {
        session.user.id = token.uid;
        session.user.roles = token.roles;
      }
      return session;
    },
  },
};

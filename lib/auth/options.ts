/**
 * next-auth configuration: e-mail and password against our users table, JWT sessions
 * that carry the user id and roles. Pages and handlers still re-read the user from the
 * database (lib/auth/session.ts), so a disabled user or a removed role takes effect at once.
 */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { getDb } from "@/db/index";
import { findUserByEmailWithHash } from "@/lib/users/queries";
import { verifyPassword } from "./password";
import { consumeAttempt, resetAttempts } from "./rate-limit";
import { signInSchema } from "./schemas";

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
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) throw new Error("Enter your e-mail address and password.");
        const { email, password } = parsed.data;
        const key = `${email}|${clientAddress(req?.headers)}`;
        await consumeAttempt("sign-in", key);
        const user = await findUserByEmailWithHash(getDb(), email);
        // Compare even for unknown e-mails so timing does not reveal who is registered.
        const ok = await verifyPassword(password, user?.passwordHash ?? "$2b$11$invalidinvalidinvalidinvalidinvalidinvalidinvalidinva");
        if (!user || !ok || user.disabled) throw new Error("That e-mail and password do not match an active account.");
        await resetAttempts("sign-in", key);
        return { id: user.id, email: user.email, name: user.name, roles: user.roles };
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

/**
 * The one-line role checks. Every page, server action and route handler calls one of
 * these on the server; nothing relies on middleware.
 */
import { cache } from "react";
import { getServerSession } from "next-auth";
import { forbidden, redirect } from "next/navigation";
import { getDb } from "@/db/index";
import type { Role } from "@/db/types";
import { findUserById, type User } from "@/lib/users/queries";
import { authOptions } from "./options";
import { hasAnyRole } from "./roles";

/** The signed-in user, fresh from the database (null when signed out or disabled). */
export const getCurrentUser = cache(async (): Promise<User | null> => {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const user = await findUserById(getDb(), id);
  return user && !user.disabled ? user : null;
});

/** For pages: signed out → sign-in page; signed in without the role → 403 page. */
export async function requirePageRole(...roles: Role[]): Promise<User> {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  if (!hasAnyRole(user.roles, roles)) forbidden();
  return user;
}

export class ForbiddenError extends Error {
  constructor(message = "You do not have the role this needs.") {
    super(message);
  }
}

/** For server actions: throws, and the action turns the error into a message. */
export async function requireActionRole(...roles: Role[]): Promise<User> {
  const user = await getCurrentUser();
  if (!user) throw new ForbiddenError("Your session has ended: sign in again.");
  if (!hasAnyRole(user.roles, roles)) throw new ForbiddenError();
  return user;
}

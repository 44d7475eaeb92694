import type { Db } from "@/db/index";
import type { Role } from "@/db/types";
import { findUserByEmailWithHash } from "@/lib/users/queries";
import { verifyPassword } from "./password";
import { consumeAttempt, resetAttempts } from "./rate-limit";
import { signInSchema } from "./schemas";

export class SignInError extends Error {}

// A valid bcrypt hash of nothing anyone knows: unknown e-mails still cost one comparison,
// so response time does not reveal who is registered.
const DECOY_HASH = "$2b$11$C6UzMDM.H6dfI/f/IKcEeO5kT0dZx1dVq9hfXcJm0Qp1A0yTq8i3K";

/** Checks an e-mail and password; counts the attempt against the rate limit. */
export async function authorizeCredentials(
  db: Db,
  credentials: unknown,
  clientAddress: string,
): Promise<{ id: string; email: string; name: string; roles: Role[] }> {
  const parsed = signInSchema.safeParse(credentials);
  if (!parsed.success) throw new SignInError("Enter your e-mail address and password.");
  const { email, password } = parsed.data;
  const key = `${email}|${clientAddress}`;
  await consumeAttempt("sign-in", key);
  const user = await findUserByEmailWithHash(db, email);
  const ok = await verifyPassword(password, user?.passwordHash ?? DECOY_HASH);
  if (!user || !ok || user.disabled) throw new SignInError("That e-mail and password do not match an active account.");
  await resetAttempts("sign-in", key);
  return { id: user.id, email: user.email, name: user.name, roles: user.roles };
}

import bcrypt from "bcryptjs";
import { z } from "zod";

// Cost 11: about 0.1 s per hash on this machine — slow for an attacker, fine for a sign-in.
const COST = 11;

/** Password rules: long enough to resist guessing; no composition rules (NIST SP 800-63B). */
export const passwordSchema = z
  .string()
  .min(12, "Use at least 12 characters.")
  .max(200, "Use at most 200 characters.");

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

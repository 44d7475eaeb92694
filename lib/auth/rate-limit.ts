/**
 * Rate limits kept in PostgreSQL (rate-limiter-flexible), so they hold across app
 * instances and restarts. Keyed by what is being protected, e.g. `email|ip`.
 */
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { getPool } from "@/db/index";

const limiters = new Map<string, RateLimiterPostgres>();

export type LimitName = "sign-in" | "token-create";

const LIMITS: Record<LimitName, { points: number; duration: number }> = {
  // 10 failed attempts per quarter hour for one address and one account.
  "sign-in": { points: 10, duration: 15 * 60 },
  "token-create": { points: 10, duration: 60 * 60 },
};

function limiter(name: LimitName): RateLimiterPostgres {
  let l = limiters.get(name);
  if (!l) {
    l = new RateLimiterPostgres({
      storeClient: getPool(),
      storeType: "pool",
      tableName: "rate_limits",
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: name,
      ...LIMITS[name],
    });
    limiters.set(name, l);
  }
  return l;
}

export class RateLimitedError extends Error {
  constructor(readonly retryAfterSeconds: number) {
    super(`Too many attempts. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`);
  }
}

/** Counts one attempt; throws RateLimitedError when the budget is spent. */
export async function consumeAttempt(name: LimitName, key: string): Promise<void> {
  try {
    await limiter(name).consume(key);
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) throw new RateLimitedError(rejection.msBeforeNext / 1000);
    throw rejection;
  }
}

/** Forgets the attempts for a key (after a successful sign-in). */
export async function resetAttempts(name: LimitName, key: string): Promise<void> {
  await limiter(name).delete(key);
}

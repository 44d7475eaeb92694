/**
 * Runs code inside a Next.js request scope, as `next start` does for every request, so
 * the real session path (getServerSession → headers() and cookies()) can be exercised
 * from a test: route handlers with a session cookie, server actions, page guards. It
 * uses Next's own request storage, which is internal API: check it on a Next upgrade.
 * tests/integration/setup.ts puts AsyncLocalStorage on globalThis first, as Next does.
 */
import { vi } from "vitest";
import { encode, type JWT } from "next-auth/jwt";
import { workAsyncStorage } from "next/dist/server/app-render/work-async-storage.external";
import { workUnitAsyncStorage } from "next/dist/server/app-render/work-unit-async-storage.external";
import { createRequestStoreForAPI } from "next/dist/server/async-storage/request-store";
import type { Role } from "@/db/types";
import { authOptions } from "@/lib/auth/options";

export const APP_ORIGIN = "http://127.0.0.1:3000";

type WorkStore = Parameters<typeof workAsyncStorage.run>[0];
type RequestStoreArgs = Parameters<typeof createRequestStoreForAPI>;

/** next-auth reads its secret and URL from the environment on each call; a run by hand may set neither. */
export function sessionSecret(): string {
  process.env.NEXTAUTH_URL ??= APP_ORIGIN;
  process.env.NEXTAUTH_SECRET ??= "integration-tests-session-secret";
  return process.env.NEXTAUTH_SECRET;
}

/** The cookie next-auth reads (the `__Secure-` variant only behind https). */
export function sessionCookieName(): string {
  return process.env.NEXTAUTH_URL?.startsWith("https://") ? "__Secure-next-auth.session-token" : "next-auth.session-token";
}

/**
 * A session token as next-auth issues it at sign-in: the claims lib/auth/options.ts puts
 * in it, encrypted with the server's secret, valid for the app's configured JWT lifetime
 * from `issuedAt` (now by default).
 */
export async function sessionToken(user: { id: string; email: string }, roles: Role[], opts: { issuedAt?: Date; secret?: string } = {}): Promise<string> {
  const token: JWT = { sub: user.id, email: user.email, uid: user.id, roles };
  const serverSecret = sessionSecret(); // also when forging: it sets next-auth's URL too
  const secret = opts.secret ?? serverSecret;
  const maxAge = authOptions.jwt?.maxAge;
  if (!opts.issuedAt) return encode({ token, secret, maxAge });
  // next-auth stamps iat and exp from the clock: move the clock, not the token.
  vi.useFakeTimers({ toFake: ["Date"], now: opts.issuedAt });
  try {
    return await encode({ token, secret, maxAge });
  } finally {
    vi.useRealTimers();
  }
}

/** Runs `work` as if serving a request for `path` that carries `headers`. */
export function inRequestScope<T>(path: string, headers: Record<string, string>, work: (request: Request) => Promise<T>): Promise<T> {
  const url = new URL(path, APP_ORIGIN);
  const all = { host: url.host, ...headers };
  const request = new Request(url, { headers: all });
  const store = createRequestStoreForAPI(
    { headers: all } as unknown as RequestStoreArgs[0],
    { pathname: url.pathname, search: url.search } as RequestStoreArgs[1],
    { tags: [], expirationsByCacheKind: new Map() } as unknown as RequestStoreArgs[2],
    undefined,
    undefined,
    undefined,
  );
  // revalidatePath() in a server action only notes its tags beside the incremental cache,
  // which nothing reads here: a placeholder is enough.
  const workStore = { page: url.pathname, route: url.pathname, incrementalCache: {} } as unknown as WorkStore;
  return workAsyncStorage.run(workStore, () => workUnitAsyncStorage.run(store, () => work(request)));
}

/** The same, with a session cookie. */
export function withSessionCookie<T>(path: string, token: string, work: (request: Request) => Promise<T>): Promise<T> {
  return inRequestScope(path, { cookie: `${sessionCookieName()}=${token}` }, work);
}

/**
 * Every route handler has the same shape: authenticate (session cookie or bearer token),
 * check the role, run, and map errors in one place (lib/api/errors.ts).
 */
import { getDb } from "@/db/index";
import type { Role } from "@/db/types";
import { userByTokenReused } from "@/lib/api-tokens/token-cache";
import { getCurrentUser } from "@/lib/auth/session";
import { hasAnyRole } from "@/lib/auth/roles";
import type { User } from "@/lib/users/queries";
import { ApiError, errorResponse } from "./errors";

export async function authenticate(request: Request): Promise<User | null> {
  const header = request.headers.get("authorization");
  if (header?.startsWith("Bearer ")) {
    const user = await userByTokenReused(getDb(), header.slice(7).trim());
    if (!user) throw new ApiError(401, "invalid_token", "The API token is unknown or has been revoked.");
    return user;
  }
  // Without a cookie there is no session to look up (and no request scope is needed for it).
  if (!request.headers.get("cookie")) return null;
  return getCurrentUser();
}

type Params = Record<string, string | string[] | undefined>;
interface Context<P> {
  request: Request;
  user: User;
  params: P;
}

/**
 * `roles: []` means any signed-in user. A missing session answers 401, a missing role 403.
 */
export function apiRoute<P extends Params = Params>(
  roles: Role[],
  run: (ctx: Context<P>) => Promise<Response>,
): (request: Request, route: { params: Promise<P> }) => Promise<Response> {
  return async (request, route) => {
    try {
      const user = await authenticate(request);
      if (!user) throw new ApiError(401, "unauthenticated", "Sign in or send an API token.");
      if (!hasAnyRole(user.roles, roles)) throw new ApiError(403, "forbidden", "Your roles do not allow this.");
      return await run({ request, user, params: route ? await route.params : ({} as P) });
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/**
 * Reads a JSON body with a size limit, answering 413/400 instead of throwing deep inside.
 * The limit is in UTF-8 bytes (a string's length counts UTF-16 units, a third of the bytes
 * for most non-Latin text); a declared Content-Length over it is refused before reading.
 */
export async function readJson(request: Request, maxBytes = 1_000_000): Promise<unknown> {
  const tooLarge = () => new ApiError(413, "too_large", `The body is larger than ${maxBytes} bytes.`);
  if (Number(request.headers.get("content-length") ?? 0) > maxBytes) throw tooLarge();
  const text = await request.text();
  if (text.length > maxBytes || Buffer.byteLength(text, "utf8") > maxBytes) throw tooLarge();
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new ApiError(400, "invalid_json", "The body is not valid JSON.");
  }
}

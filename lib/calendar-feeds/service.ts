/**
 * Subscribable calendar feeds. The secret token is the only credential a calendar app can
 * carry, so it is shown once at creation and only its sha256 is stored (as for API tokens).
 * Anyone signed in may follow a telescope, a program or their own observer blocks; only an
 * admin may follow another person's blocks.
 */
import { randomBytes } from "node:crypto";
import type { Db } from "@/db/index";
import type { FeedScope } from "@/db/types";
import { hashToken } from "@/lib/api-tokens/queries";
import { writeAudit } from "@/lib/audit/queries";
import { listBlocksForExport, type ExportFilter } from "@/lib/schedule/export/queries";
import { blocksToIcal } from "@/lib/schedule/export/ical";
import type { User } from "@/lib/users/queries";
import { findActiveFeedByHash, findScopeLabel, insertFeed, revokeFeedRow } from "./queries";
import type { CreateFeedInput } from "./schemas";

export class FeedNotAllowedError extends Error {
  constructor() {
    super("You may follow your own blocks, a telescope or a program; only an admin may follow someone else's blocks.");
  }
}

export class FeedTargetNotFoundError extends Error {
  constructor(scope: FeedScope) {
    super(`That ${scope} does not exist (any more).`);
  }
}

export class FeedNotFoundError extends Error {
  constructor() {
    super("That feed does not exist or is already revoked.");
  }
}

/** How far back a feed reaches: enough for "what did I observe last month". */
export const FEED_HISTORY_DAYS = 60;

export function newFeedToken(): string {
  return `nbf_${randomBytes(24).toString("base64url")}`;
}

export function feedPath(token: string): string {
  return `/feeds/${token}.ics`;
}

export async function createFeed(db: Db, user: User, input: CreateFeedInput): Promise<{ id: string; token: string; label: string }> {
  if (input.scope === "observer" && input.scopeId !== user.id && !user.roles.includes("admin")) throw new FeedNotAllowedError();
  const token = newFeedToken();
  return db.transaction().execute(async (trx) => {
    const label = await findScopeLabel(trx, input.scope, input.scopeId);
    if (!label) throw new FeedTargetNotFoundError(input.scope);
    const id = await insertFeed(trx, { ownerUserId: user.id, scope: input.scope, scopeId: input.scopeId, tokenHash: hashToken(token) });
    await writeAudit(trx, { actorUserId: user.id, action: "calendar_feed.create", entity: "calendar_feed", entityId: id, details: { scope: input.scope, scopeId: input.scopeId } });
    return { id, token, label };
  });
}

/** Owners revoke their own feeds; admins any. */
export async function revokeFeed(db: Db, user: User, feedId: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const done = await revokeFeedRow(trx, feedId, user.roles.includes("admin") ? null : user.id);
    if (!done) throw new FeedNotFoundError();
    await writeAudit(trx, { actorUserId: user.id, action: "calendar_feed.revoke", entity: "calendar_feed", entityId: feedId });
  });
}

function filterFor(scope: FeedScope, scopeId: string): ExportFilter {
  if (scope === "telescope") return { telescopeId: scopeId };
  if (scope === "program") return { programId: scopeId };
  return { observerUserId: scopeId };
}

/** The feed's calendar text, or null for an unknown or revoked token. */
export async function renderFeed(db: Db, token: string, now = new Date()): Promise<string | null> {
  if (!token) return null;
  const feed = await findActiveFeedByHash(db, hashToken(token));
  if (!feed) return null;
  const label = (await findScopeLabel(db, feed.scope, feed.scopeId)) ?? "Schedule";
  const from = new Date(now.getTime() - FEED_HISTORY_DAYS * 86_400_000);
  const blocks = await listBlocksForExport(db, { ...filterFor(feed.scope, feed.scopeId), from });
  return blocksToIcal(blocks, { name: `Nightbreak · ${label}`, ttlSeconds: 3600 });
}

import type { Db, Trx } from "@/db/index";
import type { FeedScope } from "@/db/types";

export interface CalendarFeed {
  id: string;
  ownerUserId: string;
  scope: FeedScope;
  scopeId: string;
  /** "Telescope AQ-24 — Alto 2.4 m", "Program P-17 — …", "Observer blocks of Ana Ruiz". */
  label: string;
  createdAt: Date;
  revokedAt: Date | null;
}

export interface FeedTargets {
  telescopes: Array<{ id: string; code: string; name: string }>;
  programs: Array<{ id: string; code: string; title: string }>;
}

export async function insertFeed(trx: Trx, feed: { ownerUserId: string; scope: FeedScope; scopeId: string; tokenHash: string }): Promise<string> {
  const { id } = await trx
    .insertInto("calendar_feeds")
    .values({ owner_user_id: feed.ownerUserId, scope: feed.scope, scope_id: feed.scopeId, token_hash: feed.tokenHash })
    .returning("id")
    .executeTakeFirstOrThrow();
  return id;
}

/** The scope's display name, or undefined when the telescope, program or user does not exist. */
export async function findScopeLabel(db: Db | Trx, scope: FeedScope, scopeId: string): Promise<string | undefined> {
  if (scope === "telescope") {
    const t = await db.selectFrom("telescopes").select(["code", "name"]).where("id", "=", scopeId).executeTakeFirst();
    return t && `Telescope ${t.code} — ${t.name}`;
  }
  if (scope === "program") {
    const p = await db.selectFrom("programs").select(["code", "title"]).where("id", "=", scopeId).executeTakeFirst();
    return p && `Program ${p.code} — ${p.title}`;
  }
  const u = await db.selectFrom("users").select("name").where("id", "=", scopeId).executeTakeFirst();
  return u && `Observer blocks of ${u.name}`;
}

export async function listFeedsForOwner(db: Db, ownerUserId: string): Promise<CalendarFeed[]> {
  const rows = await db
    .selectFrom("calendar_feeds as f")
    .leftJoin("telescopes as t", (j) => j.onRef("t.id", "=", "f.scope_id").on("f.scope", "=", "telescope"))
    .leftJoin("programs as p", (j) => j.onRef("p.id", "=", "f.scope_id").on("f.scope", "=", "program"))
    .leftJoin("users as u", (j) => j.onRef("u.id", "=", "f.scope_id").on("f.scope", "=", "observer"))
    .select(["f.id", "f.owner_user_id", "f.scope", "f.scope_id", "f.created_at", "f.revoked_at", "t.code as t_code", "t.name as t_name", "p.code as p_code", "p.title as p_title", "u.name as u_name"])
    .where("f.owner_user_id", "=", ownerUserId)
    .orderBy("f.revoked_at", (o) => o.desc().nullsFirst())
    .orderBy("f.created_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    ownerUserId: r.owner_user_id,
    scope: r.scope,
    scopeId: r.scope_id,
    label:
      r.scope === "telescope"
        ? `Telescope ${r.t_code ?? "?"} — ${r.t_name ?? "removed"}`
        : r.scope === "program"
          ? `Program ${r.p_code ?? "?"} — ${r.p_title ?? "removed"}`
          : `Observer blocks of ${r.u_name ?? "a removed user"}`,
    createdAt: r.created_at,
    revokedAt: r.revoked_at,
  }));
}

/** The active feed behind a token hash; a disabled owner's feeds stop answering too. */
export async function findActiveFeedByHash(db: Db, tokenHash: string): Promise<{ id: string; scope: FeedScope; scopeId: string } | undefined> {
  const row = await db
    .selectFrom("calendar_feeds as f")
    .innerJoin("users as u", "u.id", "f.owner_user_id")
    .select(["f.id", "f.scope", "f.scope_id"])
    .where("f.token_hash", "=", tokenHash)
    .where("f.revoked_at", "is", null)
    .where("u.disabled_at", "is", null)
    .executeTakeFirst();
  return row && { id: row.id, scope: row.scope, scopeId: row.scope_id };
}

/** Revokes an active feed; `ownerUserId` null lets an admin revoke anyone's. True when one was revoked. */
export async function revokeFeedRow(trx: Trx, feedId: string, ownerUserId: string | null): Promise<boolean> {
  let q = trx.updateTable("calendar_feeds").set({ revoked_at: new Date() }).where("id", "=", feedId).where("revoked_at", "is", null);
  if (ownerUserId) q = q.where("owner_user_id", "=", ownerUserId);
  const row = await q.returning("id").executeTakeFirst();
  return !!row;
}

export async function listFeedTargets(db: Db): Promise<FeedTargets> {
  const [telescopes, programs] = await Promise.all([
    db.selectFrom("telescopes").select(["id", "code", "name"]).orderBy("code").execute(),
    db.selectFrom("programs").select(["id", "code", "title"]).orderBy("code").execute(),
  ]);
  return { telescopes, programs };
}

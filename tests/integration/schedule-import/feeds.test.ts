import ICAL from "ical.js";
import { describe, expect, it } from "vitest";
import { GET } from "@/app/feeds/[token]/route";
import { getDb } from "@/db/index";
import { hashToken } from "@/lib/api-tokens/queries";
import { listFeedsForOwner } from "@/lib/calendar-feeds/queries";
import { createFeed, feedPath, FeedNotAllowedError, FeedNotFoundError, FeedTargetNotFoundError, revokeFeed } from "@/lib/calendar-feeds/service";
import { findUserById, type User } from "@/lib/users/queries";
import { makeUser } from "../fixtures";
import { makeImportWorld } from "./world";

async function user(roles: Parameters<typeof makeUser>[0]): Promise<User> {
  const { id } = await makeUser(roles);
  const found = await findUserById(getDb(), id);
  if (!found) throw new Error("fixture user missing");
  return found;
}

function fetchFeed(token: string) {
  return GET(new Request(`http://localhost/feeds/${token}`), { params: Promise.resolve({ token }) });
}

async function worldWithBlocks() {
  const w = await makeImportWorld();
  const db = getDb();
  // Whole hours: iCalendar times carry whole seconds.
  const hour = Math.floor(Date.now() / 3_600_000) * 3_600_000;
  const values = [
    { starts_at: new Date(hour + 86_400_000), ends_at: new Date(hour + 86_400_000 + 4 * 3_600_000), observer_user_id: w.observer.id },
    { starts_at: new Date(hour + 2 * 86_400_000), ends_at: new Date(hour + 2 * 86_400_000 + 4 * 3_600_000), observer_user_id: null },
    // Older than the feed's history: left out.
    { starts_at: new Date(hour - 200 * 86_400_000), ends_at: new Date(hour - 200 * 86_400_000 + 3_600_000), observer_user_id: w.observer.id },
  ].map((v) => ({ ...v, telescope_id: w.telescope.id, program_id: w.science.id, kind: "science" as const }));
  const blocks = await db.insertInto("blocks").values(values).returning(["id", "starts_at", "ends_at"]).execute();
  return { w, blocks };
}

describe("calendar feeds", () => {
  it("serves a telescope feed by its secret token, stored only as a hash", async () => {
    const { w, blocks } = await worldWithBlocks();
    const observer = await user(["observer"]);
    const feed = await createFeed(getDb(), observer, { scope: "telescope", scopeId: w.telescope.id });
    expect(feedPath(feed.token)).toBe(`/feeds/${feed.token}.ics`);
    const row = await getDb().selectFrom("calendar_feeds").selectAll().where("id", "=", feed.id).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashToken(feed.token));
    expect(JSON.stringify(row)).not.toContain(feed.token);

    for (const token of [feed.token, `${feed.token}.ics`]) {
      const response = await fetchFeed(token);
      expect(response.status).toBe(200);
      expect(response.headers.get("content-type")).toBe("text/calendar; charset=utf-8");
      const events = new ICAL.Component(ICAL.parse(await response.text())).getAllSubcomponents("vevent").map((c) => new ICAL.Event(c));
      expect(events.map((e) => [e.uid, e.startDate.toJSDate().getTime()])).toEqual(blocks.slice(0, 2).map((b) => [b.id, b.starts_at.getTime()]));
    }
  });

  it("answers 404 for an unknown token, a revoked feed and a disabled owner's feed", async () => {
    const { w } = await worldWithBlocks();
    expect((await fetchFeed("nbf_not-a-real-token")).status).toBe(404);
    const owner = await user(["observer"]);
    const feed = await createFeed(getDb(), owner, { scope: "program", scopeId: w.science.id });
    expect((await fetchFeed(feed.token)).status).toBe(200);
    await revokeFeed(getDb(), owner, feed.id);
    expect((await fetchFeed(feed.token)).status).toBe(404);
    await expect(revokeFeed(getDb(), owner, feed.id)).rejects.toBeInstanceOf(FeedNotFoundError);

    const leaver = await user(["pi"]);
    const other = await createFeed(getDb(), leaver, { scope: "program", scopeId: w.science.id });
    await getDb().updateTable("users").set({ disabled_at: new Date() }).where("id", "=", leaver.id).execute();
    expect((await fetchFeed(other.token)).status).toBe(404);
  });

  it("lets anyone follow their own blocks, and only an admin someone else's", async () => {
    const { w, blocks } = await worldWithBlocks();
    const observer = await findUserById(getDb(), w.observer.id);
    if (!observer) throw new Error("fixture user missing");
    const own = await createFeed(getDb(), observer, { scope: "observer", scopeId: observer.id });
    const events = new ICAL.Component(ICAL.parse(await (await fetchFeed(own.token)).text())).getAllSubcomponents("vevent");
    expect(events.map((e) => e.getFirstPropertyValue("uid"))).toEqual([blocks[0]?.id]);

    const nosy = await user(["director"]);
    await expect(createFeed(getDb(), nosy, { scope: "observer", scopeId: observer.id })).rejects.toBeInstanceOf(FeedNotAllowedError);
    const admin = await user(["admin"]);
    await expect(createFeed(getDb(), admin, { scope: "observer", scopeId: observer.id })).resolves.toHaveProperty("token");
    await expect(createFeed(getDb(), nosy, { scope: "telescope", scopeId: w.science.id })).rejects.toBeInstanceOf(FeedTargetNotFoundError);
  });

  it("lists my feeds with labels; only the owner or an admin may revoke", async () => {
    const { w } = await worldWithBlocks();
    const owner = await user(["pi"]);
    const stranger = await user(["pi"]);
    const feed = await createFeed(getDb(), owner, { scope: "telescope", scopeId: w.telescope.id });
    await expect(revokeFeed(getDb(), stranger, feed.id)).rejects.toBeInstanceOf(FeedNotFoundError);
    const listed = await listFeedsForOwner(getDb(), owner.id);
    expect(listed).toEqual([expect.objectContaining({ id: feed.id, scope: "telescope", label: expect.stringContaining(`Telescope ${w.telescope.code}`), revokedAt: null })]);
    expect(await listFeedsForOwner(getDb(), stranger.id)).toEqual([]);
    await revokeFeed(getDb(), await user(["admin"]), feed.id);
    expect((await listFeedsForOwner(getDb(), owner.id))[0]?.revokedAt).toBeInstanceOf(Date);
  });
});

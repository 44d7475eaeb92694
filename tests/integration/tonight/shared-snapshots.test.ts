import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { acknowledgeChanges } from "@/lib/tonight/acknowledge";
import { forgetNightSnapshots } from "@/lib/tonight/night-snapshots";
import { loadChangesAfter } from "@/lib/tonight/queries";
import { getTonightQueue } from "@/lib/tonight/queue";
import { makeUser } from "../fixtures";
import { addBlock, addChange, makeNightDesk, SANTIAGO_SITE } from "./helpers";

const NIGHT = "2027-04-03";
const NOW = new Date("2027-04-04T01:00:00Z");
const SHARED = { maxAgeMs: 60_000 };

async function desk() {
  const d = await makeNightDesk(SANTIAGO_SITE);
  const block = await addBlock(d, "2027-04-04T02:00:00Z", "2027-04-04T03:30:00Z");
  const first = await addChange(d, { kind: "override", startsAt: "2027-04-04T02:00:00Z", endsAt: "2027-04-04T03:30:00Z", summary: "First", blockId: block });
  const assistant = { id: d.assistant.id, name: "Fixture assistant", roles: ["night_assistant" as const] };
  return { d, block, first, assistant };
}

describe("night snapshots shared between open queue pages", () => {
  it("reuse a snapshot within its age, so a write from elsewhere shows once it expires (a fresh read sees it at once)", async () => {
    forgetNightSnapshots();
    const { d, assistant } = await desk();
    const before = await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, SHARED);
    expect(before.changes.items).toHaveLength(1);
    // As another app instance would: straight into the database, bypassing this process.
    await addChange(d, { kind: "removed", startsAt: "2027-04-04T02:00:00Z", endsAt: "2027-04-04T03:30:00Z", summary: "Second" });
    expect((await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, SHARED)).changes.items).toHaveLength(1);
    expect((await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW)).changes.items).toHaveLength(2);
    expect((await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, { maxAgeMs: 1 })).changes.items).toHaveLength(2);
  });

  it("are forgotten when this process writes: an acknowledgement clears the highlight on the very next poll", async () => {
    forgetNightSnapshots();
    const { d, first, assistant } = await desk();
    const before = await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, SHARED);
    expect(before.changes.throughChangeId).toBe(first);
    await acknowledgeChanges(getDb(), assistant, d.telescopeCode, { throughChangeId: first });
    const after = await getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, SHARED);
    expect(after.changes.items).toEqual([]);
    expect(after.acknowledgements.mine?.throughChangeId).toBe(first);
  });

  it("give each viewer their own view of one shared snapshot", async () => {
    forgetNightSnapshots();
    const { d, first, assistant } = await desk();
    await acknowledgeChanges(getDb(), assistant, d.telescopeCode, { throughChangeId: first });
    const colleague = await makeUser(["night_assistant"]);
    await getDb().insertInto("telescope_assistants").values({ telescope_id: d.telescopeId, user_id: colleague.id }).execute();
    const director = await makeUser(["director"]);
    const [mine, theirs, directors] = await Promise.all([
      getTonightQueue(getDb(), assistant, d.telescopeCode, NIGHT, NOW, SHARED),
      getTonightQueue(getDb(), { id: colleague.id, roles: ["night_assistant"] }, d.telescopeCode, NIGHT, NOW, SHARED),
      getTonightQueue(getDb(), { id: director.id, roles: ["director"] }, d.telescopeCode, NIGHT, NOW, SHARED),
    ]);
    expect([mine.changes.basis, mine.changes.items.length, mine.permissions.canAcknowledge]).toEqual(["mine", 0, true]);
    expect([theirs.changes.basis, theirs.changes.items.map((c) => c.id), theirs.acknowledgements.mine]).toEqual(["mine", [first], null]);
    expect([directors.changes.basis, directors.changes.items.length, directors.permissions.canAcknowledge]).toEqual(["telescope", 0, false]);
  });

  it("read the changes after a watermark from the database when a night has more than a snapshot carries", async () => {
    const { d, first } = await desk();
    const later = [];
    for (let i = 0; i < 3; i++) later.push(await addChange(d, { kind: "moved", startsAt: "2027-04-04T02:00:00Z", endsAt: "2027-04-04T03:30:00Z", summary: `Later ${i}` }));
    const since = new Date("2027-04-03T18:00:00Z");
    const all = await loadChangesAfter(getDb(), { telescopeId: d.telescopeId, changesSince: since, watermark: 0, limit: 2 });
    expect(all).toMatchObject({ total: 4 });
    expect(all.items.map((c) => c.id)).toEqual([first, later[0]]);
    const after = await loadChangesAfter(getDb(), { telescopeId: d.telescopeId, changesSince: since, watermark: later[0] ?? 0, limit: 10 });
    expect(after.items.map((c) => c.id)).toEqual(later.slice(1));
    expect(after.total).toBe(2);
  });
});

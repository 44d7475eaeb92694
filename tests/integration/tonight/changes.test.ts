import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { acknowledgeChanges } from "@/lib/tonight/acknowledge";
import { getTonightQueue } from "@/lib/tonight/queue";
import { addApprovedRequest, addBlock, addChange, makeNightDesk, SANTIAGO_SITE } from "./helpers";
import { makeUser } from "../fixtures";

const NIGHT = "2027-04-03";
const NOW = new Date("2027-04-04T01:00:00Z");

async function deskWithOverride() {
  const desk = await makeNightDesk(SANTIAGO_SITE);
  const displaced = await addBlock(desk, "2027-04-03T23:30:00Z", "2027-04-04T02:00:00Z");
  const requestId = await addApprovedRequest(desk, { name: "Fixture Comet Q7", raDeg: 120, decDeg: -20 }, { start: "2027-04-03T20:00:00Z", end: "2027-04-04T10:00:00Z" });
  const tooBlock = await addBlock(desk, "2027-04-04T02:00:00Z", "2027-04-04T03:30:00Z", { kind: "too", tooRequestId: requestId });
  const untouched = await addBlock(desk, "2027-04-04T03:30:00Z", "2027-04-04T06:00:00Z");
  const override = await addChange(desk, { kind: "override", startsAt: "2027-04-04T02:00:00Z", endsAt: "2027-04-04T03:30:00Z", summary: "Override approved", blockId: tooBlock, requestId });
  const trimmed = await addChange(desk, { kind: "displaced", startsAt: "2027-04-04T02:00:00Z", endsAt: "2027-04-04T03:30:00Z", summary: "Loses 90 min (trim end)", blockId: displaced, requestId });
  const assistant = { id: desk.assistant.id, name: `Fixture ${desk.assistant.email}`, roles: ["night_assistant" as const] };
  return { desk, displaced, tooBlock, untouched, override, trimmed, requestId, assistant };
}

describe("changes since the last acknowledgement", () => {
  it("highlights an override and the block it displaced, with the target's name, until acknowledged", async () => {
    const s = await deskWithOverride();
    const before = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, NIGHT, NOW);
    expect(before.changes.basis).toBe("mine");
    expect(before.changes.items.map((c) => [c.id, c.kind, c.targetName])).toEqual([
      [s.override, "override", "Fixture Comet Q7"],
      [s.trimmed, "displaced", "Fixture Comet Q7"],
    ]);
    expect(before.changes.throughChangeId).toBe(s.trimmed);
    expect(before.blocks.map((b) => [b.id, b.changed])).toEqual([
      [s.displaced, true],
      [s.tooBlock, true],
      [s.untouched, false],
    ]);
    expect(before.acknowledgements.mine).toBeNull();

    const ack = await acknowledgeChanges(getDb(), s.assistant, s.desk.telescopeCode, { throughChangeId: s.trimmed });
    expect(ack).toMatchObject({ throughChangeId: s.trimmed, userName: s.assistant.name });

    const after = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, NIGHT, NOW);
    expect(after.changes.items).toEqual([]);
    expect(after.changes.throughChangeId).toBeNull();
    expect(after.blocks.some((b) => b.changed)).toBe(false);
    expect(after.acknowledgements.mine?.throughChangeId).toBe(s.trimmed);

    const audit = await getDb().selectFrom("audit_log").select(["action", "actor_user_id"]).where("entity_id", "=", s.desk.telescopeId).execute();
    expect(audit).toEqual([{ action: "tonight.acknowledge", actor_user_id: s.desk.assistant.id }]);
  });

  it("acknowledges only what the person saw: a change arriving later stays highlighted", async () => {
    const s = await deskWithOverride();
    const seen = (await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, NIGHT, NOW)).changes.throughChangeId;
    const late = await addChange(s.desk, { kind: "removed", startsAt: "2027-04-04T03:30:00Z", endsAt: "2027-04-04T06:00:00Z", summary: "Block removed", blockId: s.untouched });
    await acknowledgeChanges(getDb(), s.assistant, s.desk.telescopeCode, { throughChangeId: seen ?? 0 });
    const after = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, NIGHT, NOW);
    expect(after.changes.items.map((c) => c.id)).toEqual([late]);
    expect(after.blocks.find((b) => b.id === s.untouched)?.changed).toBe(true);
    // Acknowledging an older change again never steps the watermark back.
    const again = await acknowledgeChanges(getDb(), s.assistant, s.desk.telescopeCode, { throughChangeId: s.override });
    expect(again.throughChangeId).toBe(seen);
  });

  it("keeps each night assistant's acknowledgements apart, and shows directors what nobody has acknowledged yet", async () => {
    const s = await deskWithOverride();
    const colleague = await makeUser(["night_assistant"]);
    await getDb().insertInto("telescope_assistants").values({ telescope_id: s.desk.telescopeId, user_id: colleague.id }).execute();
    await acknowledgeChanges(getDb(), s.assistant, s.desk.telescopeCode, { throughChangeId: s.override });

    const theirs = await getTonightQueue(getDb(), { id: colleague.id, roles: ["night_assistant"] }, s.desk.telescopeCode, NIGHT, NOW);
    expect(theirs.changes.items.map((c) => c.id)).toEqual([s.override, s.trimmed]);

    const director = await makeUser(["director"]);
    const directorView = await getTonightQueue(getDb(), { id: director.id, roles: ["director"] }, s.desk.telescopeCode, NIGHT, NOW);
    expect(directorView.changes.basis).toBe("telescope");
    expect(directorView.changes.items.map((c) => c.id)).toEqual([s.trimmed]);
    expect(directorView.permissions).toEqual({ canAcknowledge: false, canLog: false });
    expect(directorView.acknowledgements.recent).toEqual([expect.objectContaining({ userName: s.assistant.name, throughChangeId: s.override })]);
  });

  it("leaves out changes to time already past before the night, and refuses unknown change ids", async () => {
    const s = await deskWithOverride();
    await addChange(s.desk, { kind: "moved", startsAt: "2027-04-01T01:00:00Z", endsAt: "2027-04-01T02:00:00Z", summary: "Old news" });
    const queue = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, NIGHT, NOW);
    expect(queue.changes.items.map((c) => c.summary)).toEqual(["Override approved", "Loses 90 min (trim end)"]);
    await expect(acknowledgeChanges(getDb(), s.assistant, s.desk.telescopeCode, { throughChangeId: s.trimmed + 1000 })).rejects.toThrow(/There is no change/);
  });

  it("lets only the telescope's own night assistants and admins acknowledge", async () => {
    const s = await deskWithOverride();
    const stranger = await makeUser(["night_assistant"]);
    await expect(acknowledgeChanges(getDb(), { id: stranger.id, name: "Other", roles: ["night_assistant"] }, s.desk.telescopeCode, { throughChangeId: s.trimmed })).rejects.toThrow(
      /Only the night assistants of/,
    );
    const admin = await makeUser(["admin"]);
    await expect(acknowledgeChanges(getDb(), { id: admin.id, name: "Admin", roles: ["admin"] }, s.desk.telescopeCode, { throughChangeId: s.trimmed })).resolves.toMatchObject({
      throughChangeId: s.trimmed,
    });
  });
});

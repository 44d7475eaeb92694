import { describe, expect, it } from "vitest";
import type { NightSnapshot } from "@/lib/tonight/queries";
import type { QueueChange } from "@/lib/tonight/types";
import { viewOf } from "@/lib/tonight/viewer-view";

const change = (id: number): QueueChange => ({
  id,
  kind: "override",
  at: "2027-04-04T01:00:00.000Z",
  startsAt: "2027-04-04T02:00:00.000Z",
  endsAt: "2027-04-04T03:00:00.000Z",
  summary: `change ${id}`,
  blockId: null,
  requestId: null,
  targetName: null,
});
const ack = (userName: string, throughChangeId: number) => ({ userName, at: "2027-04-04T01:30:00.000Z", throughChangeId });

function snapshot(over: Partial<NightSnapshot> = {}): NightSnapshot {
  return {
    blocks: [],
    changes: [3, 5, 8, 9].map(change),
    changesComplete: true,
    assistantIds: ["na-1", "na-2"],
    acknowledgers: [
      { userId: "na-1", last: ack("One", 5), highest: 5 },
      { userId: "na-2", last: ack("Two", 8), highest: 8 },
    ],
    recent: [ack("Two", 8), ack("One", 5)],
    ...over,
  };
}

describe("one viewer's view of a shared night snapshot", () => {
  it("gives an assigned night assistant their own watermark and last acknowledgement", () => {
    const view = viewOf(snapshot(), { id: "na-1", roles: ["night_assistant"] }, 100);
    expect(view).toMatchObject({ operate: true, watermark: 5, mine: { userName: "One", throughChangeId: 5 } });
    expect(view.changes?.items.map((c) => c.id)).toEqual([8, 9]);
    expect(view.changes?.total).toBe(2);
  });

  it("gives a night assistant of another telescope, and a director, the telescope's watermark (anyone's highest)", () => {
    for (const viewer of [{ id: "na-9", roles: ["night_assistant" as const] }, { id: "dir", roles: ["director" as const] }]) {
      const view = viewOf(snapshot(), viewer, 100);
      expect(view.operate).toBe(false);
      expect(view.watermark).toBe(8);
      expect(view.changes?.items.map((c) => c.id)).toEqual([9]);
      expect(view.mine).toBeNull();
    }
  });

  it("lets an admin act with their own watermark, which starts at nothing acknowledged", () => {
    const view = viewOf(snapshot(), { id: "adm", roles: ["admin"] }, 100);
    expect(view).toMatchObject({ operate: true, watermark: 0 });
    expect(view.changes?.items.map((c) => c.id)).toEqual([3, 5, 8, 9]);
  });

  it("lists at most `limit` changes but counts them all", () => {
    const view = viewOf(snapshot(), { id: "adm", roles: ["admin"] }, 2);
    expect(view.changes?.items.map((c) => c.id)).toEqual([3, 5]);
    expect(view.changes?.total).toBe(4);
  });

  it("says when a truncated snapshot does not reach back to the viewer's watermark (the caller then asks the database)", () => {
    const truncated = snapshot({ changes: [7, 8, 9].map(change), changesComplete: false });
    expect(viewOf(truncated, { id: "na-1", roles: ["night_assistant"] }, 100).changes).toBeNull(); // watermark 5: change 6 may exist
    expect(viewOf(truncated, { id: "na-2", roles: ["night_assistant"] }, 100).changes?.items.map((c) => c.id)).toEqual([9]);
    const edge = snapshot({ changes: [6, 8, 9].map(change), changesComplete: false });
    expect(viewOf(edge, { id: "na-1", roles: ["night_assistant"] }, 100).changes?.items.map((c) => c.id)).toEqual([6, 8, 9]);
  });
});

/**
 * One viewer's view of a night snapshot: whether they may act, which changes they have not
 * acknowledged, and their own last acknowledgement. Pure, so every open page can share one
 * snapshot of the night.
 */
import type { Role } from "@/db/types";
import { canOperate } from "./access";
import type { NightSnapshot } from "./queries";
import type { QueueAcknowledgement, QueueChange } from "./types";

export interface ViewerView {
  /** The viewer may acknowledge and log here (admin, or a night assistant of this telescope). */
  operate: boolean;
  /** The watermark: the viewer's own when they may acknowledge, otherwise the telescope's (anyone's). */
  watermark: number;
  /** Unacknowledged changes, oldest first, at most `limit`, and how many there are in all; null when the snapshot does not reach back to the watermark. */
  changes: { items: QueueChange[]; total: number } | null;
  mine: QueueAcknowledgement | null;
}

export function viewOf(snapshot: NightSnapshot, viewer: { id: string; roles: readonly Role[] }, limit: number): ViewerView {
  const operate = canOperate(viewer.roles, snapshot.assistantIds.includes(viewer.id));
  const own = snapshot.acknowledgers.find((a) => a.userId === viewer.id);
  const watermark = operate ? (own?.highest ?? 0) : Math.max(0, ...snapshot.acknowledgers.map((a) => a.highest));
  const reachesBack = snapshot.changesComplete || (snapshot.changes[0] !== undefined && snapshot.changes[0].id <= watermark + 1);
  const unacknowledged = snapshot.changes.filter((c) => c.id > watermark);
  return {
    operate,
    watermark,
    changes: reachesBack ? { items: unacknowledged.slice(0, limit), total: unacknowledged.length } : null,
    mine: own?.last ?? null,
  };
}

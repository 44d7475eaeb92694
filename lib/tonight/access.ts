import type { Role } from "@/db/types";

/** Who may read tonight's queue; only some of them may act on it (see canOperate). */
export const QUEUE_VIEW_ROLES: Role[] = ["night_assistant", "director", "observer", "admin"];

/** Acknowledging changes and logging outcomes: the telescope's own night assistants, and admins. */
export function canOperate(roles: readonly Role[], assignedToTelescope: boolean): boolean {
  return roles.includes("admin") || (roles.includes("night_assistant") && assignedToTelescope);
}

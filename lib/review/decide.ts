/**
 * One entry point for the three decisions, shared by the review page's actions and the
 * decision route: approve a slot (the splice), decline with a reason, return to the PI.
 */
import type { Db } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { declineRequest, returnRequest } from "@/lib/decisions/decline";
import type { User } from "@/lib/users/queries";
import type { DecisionInput } from "./schemas";

export type DecisionOutcome =
  | { decision: "approve"; state: "approved"; alreadyApproved: boolean; tooBlockId: string | null; displacedMinutes: number }
  | { decision: "decline"; state: "declined" }
  | { decision: "return"; state: "draft" };

export async function decide(db: Db, director: User, requestId: string, input: DecisionInput): Promise<DecisionOutcome> {
  switch (input.decision) {
    case "approve": {
      const result = await approveRequest(db, director, { requestId, telescopeId: input.telescopeId, start: input.start, end: input.end, note: input.note || undefined });
      return { decision: "approve", state: "approved", ...result };
    }
    case "decline":
      await declineRequest(db, director, { requestId, reason: input.reason });
      return { decision: "decline", state: "declined" };
    case "return":
      await returnRequest(db, director, { requestId, note: input.note });
      return { decision: "return", state: "draft" };
  }
}

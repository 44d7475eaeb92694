import { z } from "zod";
import { getDb } from "@/db/index";
import { ApiError, errorResponse } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { DecisionError, SlotTakenError } from "@/lib/decisions/errors";
import { impactJson } from "@/lib/impact/json";
import { getSlotImpact } from "@/lib/impact/service";
import { decide } from "@/lib/review/decide";
import { decisionSchema } from "@/lib/review/schemas";

type Params = { id: string };

// POST /api/v1/too-requests/{id}/decision — a director approves a slot, declines (reason
// required) or returns the request to the PI (note required). A slot taken a moment ago
// by another override answers 409 with the slot's fresh impact.
export const POST = apiRoute<Params>(["director"], async ({ request, user, params }) => {
  if (!z.uuid().safeParse(params.id).success) throw new ApiError(404, "not_found", "No such request.");
  const input = decisionSchema.parse(await readJson(request));
  try {
    const outcome = await decide(getDb(), user, params.id, input);
    return Response.json({ requestId: params.id, ...outcome });
  } catch (e) {
    if (e instanceof SlotTakenError && input.decision === "approve") {
      const impact = await getSlotImpact(getDb(), { telescope: input.telescopeId, start: input.start, end: input.end }).catch(() => null);
      return Response.json({ error: { code: "slot_taken", message: e.message }, impact: impact && impactJson(impact) }, { status: 409 });
    }
    if (e instanceof DecisionError) return errorResponse(new ApiError(e.status, e.status === 404 ? "not_found" : e.status === 400 ? "invalid_decision" : "conflict", e.message));
    throw e;
  }
});

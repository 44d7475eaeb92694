import { getDb } from "@/db/index";
import { apiRoute, readJson } from "@/lib/api/handler";
import { acknowledgeChanges } from "@/lib/tonight/acknowledge";
import { toTonightApiError } from "@/lib/tonight/errors";
import { acknowledgeSchema, telescopeRefSchema } from "@/lib/tonight/schemas";

// POST { throughChangeId }: the caller has seen every change on the telescope up to that one.
export const POST = apiRoute<{ id: string }>(["night_assistant", "admin"], async ({ request, user, params }) => {
  const ref = telescopeRefSchema.parse(params.id);
  const input = acknowledgeSchema.parse(await readJson(request));
  const acknowledgement = await acknowledgeChanges(getDb(), user, ref, input).catch((e: unknown) => {
    throw toTonightApiError(e);
  });
  return Response.json({ acknowledgement }, { status: 201 });
});

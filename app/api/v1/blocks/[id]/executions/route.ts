import { z } from "zod";
import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { logExecution } from "@/lib/tonight/execution-log";
import { toTonightApiError } from "@/lib/tonight/errors";
import { executionLogSchema } from "@/lib/tonight/schemas";

// POST { outcome, minutesUsed?, note? }: the night log of one block (its telescope's night assistants, admins).
export const POST = apiRoute<{ id: string }>(["night_assistant", "admin"], async ({ request, user, params }) => {
  const id = z.uuid().safeParse(params.id);
  if (!id.success) throw new ApiError(404, "not_found", "No such block.");
  const input = executionLogSchema.parse(await readJson(request));
  const execution = await logExecution(getDb(), user, id.data, input).catch((e: unknown) => {
    throw toTonightApiError(e);
  });
  return Response.json({ execution }, { status: 201 });
});

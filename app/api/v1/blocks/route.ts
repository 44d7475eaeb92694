import { getDb } from "@/db/index";
import { apiRoute, readJson } from "@/lib/api/handler";
import { toScheduleApiError } from "@/lib/schedule/api-errors";
import { blockInputSchema } from "@/lib/schedule/schemas";
import { createBlock } from "@/lib/schedule/service";

export const POST = apiRoute(["admin"], async ({ request, user }) => {
  const input = blockInputSchema.parse(await readJson(request));
  const id = await createBlock(getDb(), user.id, input).catch((e: unknown) => {
    throw toScheduleApiError(e);
  });
  return Response.json({ id }, { status: 201 });
});

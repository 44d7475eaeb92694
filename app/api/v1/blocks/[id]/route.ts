import { z } from "zod";
import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute, readJson } from "@/lib/api/handler";
import { toScheduleApiError } from "@/lib/schedule/api-errors";
import { getBlockDetail } from "@/lib/schedule/calendar-queries";
import { blockPatchSchema } from "@/lib/schedule/schemas";
import { deleteBlock, updateBlock } from "@/lib/schedule/service";

type Params = { id: string };
const idSchema = z.uuid("Unknown block.");

function blockId(params: Params): string {
  const parsed = idSchema.safeParse(params.id);
  if (!parsed.success) throw new ApiError(404, "not_found", "No such block.");
  return parsed.data;
}

export const GET = apiRoute<Params>([], async ({ params }) => {
  const block = await getBlockDetail(getDb(), blockId(params));
  if (!block) throw new ApiError(404, "not_found", "No such block.");
  return Response.json({ block });
});

export const PATCH = apiRoute<Params>(["admin"], async ({ params, request, user }) => {
  const id = blockId(params);
  const patch = blockPatchSchema.parse(await readJson(request));
  await updateBlock(getDb(), user.id, id, patch).catch((e: unknown) => {
    throw toScheduleApiError(e);
  });
  return Response.json({ block: await getBlockDetail(getDb(), id) });
});

export const DELETE = apiRoute<Params>(["admin"], async ({ params, user }) => {
  await deleteBlock(getDb(), user.id, blockId(params)).catch((e: unknown) => {
    throw toScheduleApiError(e);
  });
  return new Response(null, { status: 204 });
});

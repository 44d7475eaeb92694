import { getDb } from "@/db/index";
import { ApiError } from "@/lib/api/errors";
import { apiRoute } from "@/lib/api/handler";
import { markNoticeRead } from "@/lib/notices/queries";
import { noticeIdSchema } from "@/lib/notices/schemas";

type Params = { id: string };

// Somebody else's notice answers 404, exactly like a missing one.
export const POST = apiRoute<Params>([], async ({ params, user }) => {
  const id = noticeIdSchema.safeParse(params.id);
  if (!id.success || !(await markNoticeRead(getDb(), user.id, id.data))) throw new ApiError(404, "not_found", "No such notice.");
  return new Response(null, { status: 204 });
});

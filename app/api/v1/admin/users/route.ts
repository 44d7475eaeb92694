import { getDb } from "@/db/index";
import { apiRoute, readJson } from "@/lib/api/handler";
import { ApiError } from "@/lib/api/errors";
import { EmailTakenError, listUsers } from "@/lib/users/queries";
import { createUserSchema } from "@/lib/users/schemas";
import { createUser } from "@/lib/users/service";

export const GET = apiRoute(["admin"], async () => {
  const users = await listUsers(getDb());
  return Response.json({ users });
});

export const POST = apiRoute(["admin"], async ({ request, user }) => {
  const input = createUserSchema.parse(await readJson(request));
  try {
    const id = await createUser(getDb(), user.id, input);
    return Response.json({ id }, { status: 201 });
  } catch (error) {
    if (error instanceof EmailTakenError) throw new ApiError(409, "email_taken", error.message);
    throw error;
  }
});

import { z } from "zod";
import { getDb } from "@/db/index";
import { apiRoute, readJson } from "@/lib/api/handler";
import { getEmailPreferences, setEmailPreferences } from "@/lib/notices/queries";
import { emailPreferencesSchema } from "@/lib/notices/schemas";

const bodySchema = z.object({ email: emailPreferencesSchema });

// Which events reach the signed-in user by e-mail (in-app notices always arrive).
export const GET = apiRoute([], async ({ user }) => Response.json({ email: await getEmailPreferences(getDb(), user.id) }));

export const PUT = apiRoute([], async ({ request, user }) => {
  const body = bodySchema.parse(await readJson(request, 10_000));
  await setEmailPreferences(getDb(), user.id, body.email);
  return Response.json({ email: await getEmailPreferences(getDb(), user.id) });
});

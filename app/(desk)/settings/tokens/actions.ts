"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { createTokenSchema, revokeTokenSchema } from "@/lib/api-tokens/schemas";
import { createApiToken, revokeOwnApiToken, TokenNotFoundError } from "@/lib/api-tokens/service";
import { requireActionRole } from "@/lib/auth/session";

/** Creates a token and answers its secret — the only time it is ever shown. */
export async function createTokenAction(input: unknown): Promise<ActionResult<{ secret: string; name: string }>> {
  return runAction(async () => {
    const user = await requireActionRole();
    const { name } = createTokenSchema.parse(input);
    const { secret } = await createApiToken(getDb(), user.id, name);
    revalidatePath("/settings/tokens");
    return { ok: true, message: "Token created.", data: { secret, name } };
  });
}

export async function revokeTokenAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole();
    const { id } = revokeTokenSchema.parse(input);
    await revokeOwnApiToken(getDb(), user.id, id);
    revalidatePath("/settings/tokens");
    return { ok: true, message: "Token revoked: it no longer works." };
  }, [TokenNotFoundError]);
}

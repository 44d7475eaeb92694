"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { EmailTakenError } from "@/lib/users/queries";
import { createUserSchema, updateRolesSchema } from "@/lib/users/schemas";
import { createUser, LastAdminError, setUserRoles } from "@/lib/users/service";

export async function createUserAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionRole("admin");
    const values = createUserSchema.parse(input);
    await createUser(getDb(), admin.id, values);
    revalidatePath("/admin/users");
    return { ok: true, message: `${values.name} can now sign in as ${values.email}.` };
  }, [EmailTakenError]);
}

export async function updateRolesAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionRole("admin");
    const values = updateRolesSchema.parse(input);
    await setUserRoles(getDb(), admin.id, values.userId, values.roles);
    revalidatePath("/admin/users");
    return { ok: true, message: "Roles saved." };
  }, [LastAdminError]);
}

"use server";

import { revalidatePath } from "next/cache";
import { runAction, UserFacingError, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { fakeFaultsSchema, localFakeUrl, setFakeFaults } from "@/lib/notices/outbox";

/** Tells the local e-mail fake to fail a share of requests, to watch retries work. */
export async function setFakeFaultsAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    await requireActionRole("admin");
    const base = localFakeUrl();
    if (!base) throw new UserFacingError("E-mail goes to the real mail service here: there is no local fake to control.");
    const faults = fakeFaultsSchema.parse(input);
    await setFakeFaults(base, faults).catch((error: unknown) => {
      throw new UserFacingError(`The e-mail fake did not take the setting: ${error instanceof Error ? error.message : String(error)}`);
    });
    revalidatePath("/admin/outbox");
    return { ok: true, message: `The fake now fails ${Math.round(faults.failRate * 100)} % of requests.` };
  });
}

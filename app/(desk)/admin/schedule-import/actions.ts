"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { checkImportFile, ImportRejectedError, importFile } from "@/lib/schedule/import/service";
import { readUpload } from "@/lib/schedule/import/upload";
import { toCheckView, type ImportCheckView } from "@/lib/schedule/import/view";

/** The dry run: parse and plan, write nothing. */
export async function checkImportAction(form: FormData): Promise<ActionResult<ImportCheckView>> {
  return runAction(async () => {
    await requireActionRole("admin");
    const { fileName, text } = await readUpload(form);
    const checked = await checkImportFile(getDb(), fileName, text);
    return { ok: true, data: toCheckView(fileName, checked) };
  });
}

/** The commit: the server parses and plans the same file again; all rows or none. */
export async function commitImportAction(form: FormData): Promise<ActionResult<{ created: number }>> {
  return runAction(async () => {
    const admin = await requireActionRole("admin");
    const { fileName, text } = await readUpload(form);
    const { created } = await importFile(getDb(), admin.id, fileName, text);
    revalidatePath("/schedule");
    return { ok: true, message: `Imported ${created} block${created === 1 ? "" : "s"} from ${fileName}.`, data: { created } };
  }, [ImportRejectedError]);
}

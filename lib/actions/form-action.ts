import { z } from "zod";
import { FieldError, RecordNotFoundError } from "./domain-errors";
import { runAction, type ActionResult } from "./result";

/** runAction, plus FieldError shown beside its field as well as in the form's message. */
export async function runFormAction<T>(work: () => Promise<ActionResult<T>>): Promise<ActionResult<T>> {
  return runAction(async () => {
    try {
      return await work();
    } catch (error) {
      if (error instanceof FieldError) return { ok: false, message: error.message, fieldErrors: { [error.field]: error.message } };
      throw error;
    }
  });
}

/** Record ids come from the page, not the person; a malformed one means the record is gone. */
export function parseRecordId(id: unknown, noun: string): string {
  const parsed = z.uuid().safeParse(id);
  if (!parsed.success) throw new RecordNotFoundError(noun);
  return parsed.data;
}

/**
 * Who may attach files, and recording an attachment once its stored bytes have passed the
 * content check. Only the PI's own draft takes attachments: a filed request is read-only.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { lockRequest } from "@/lib/requests/queries";
import type { User } from "@/lib/users/queries";
import { insertAttachment, type Attachment, type NewAttachment } from "./queries";

export class UploadRefusedError extends Error {}

async function assertOwnDraft(load: () => Promise<{ piUserId: string; state: string } | undefined>, userId: string): Promise<void> {
  const request = await load();
  if (!request || request.piUserId !== userId) throw new UploadRefusedError("That request does not exist, or it is not yours.");
  if (request.state !== "draft") throw new UploadRefusedError("This request has been filed: its attachments can no longer change.");
}

export async function authorizeUpload(db: Db, user: User | null, requestId: string): Promise<void> {
  if (!user) throw new UploadRefusedError("Your session has ended: sign in again to attach files.");
  if (!user.roles.includes("pi")) throw new UploadRefusedError("Only a PI can attach files to a request.");
  await assertOwnDraft(
    async () => {
      const row = await db.selectFrom("too_requests").select(["pi_user_id", "state"]).where("id", "=", requestId).executeTakeFirst();
      return row && { piUserId: row.pi_user_id, state: row.state };
    },
    user.id,
  );
}

/** Re-checks ownership and state under a row lock (the PI may have filed meanwhile), then records. */
export async function recordAttachment(db: Db, attachment: NewAttachment): Promise<Attachment> {
  return db.transaction().execute(async (trx) => {
    await assertOwnDraft(() => lockRequest(trx, attachment.requestId), attachment.uploadedBy);
    const saved = await insertAttachment(trx, attachment);
    await writeAudit(trx, {
      actorUserId: attachment.uploadedBy,
      action: "request.attach",
      entity: "too_request",
      entityId: attachment.requestId,
      details: { attachmentId: saved.id, kind: saved.kind, fileName: saved.fileName, sizeBytes: saved.sizeBytes },
    });
    return saved;
  });
}

import type { Db, Trx } from "@/db/index";
import type { AttachmentKind } from "@/db/types";

export interface Attachment {
  id: string;
  requestId: string;
  kind: AttachmentKind;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  storageKey: string;
  url: string;
  uploadedBy: string;
  createdAt: Date;
}

export interface NewAttachment {
  requestId: string;
  kind: AttachmentKind;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  storageKey: string;
  url: string;
  uploadedBy: string;
}

type Row = {
  id: string;
  request_id: string;
  kind: AttachmentKind;
  file_name: string;
  content_type: string;
  size_bytes: number;
  storage_key: string;
  url: string;
  uploaded_by: string;
  created_at: Date;
};

function toAttachment(r: Row): Attachment {
  return {
    id: r.id,
    requestId: r.request_id,
    kind: r.kind,
    fileName: r.file_name,
    contentType: r.content_type,
    sizeBytes: r.size_bytes,
    storageKey: r.storage_key,
    url: r.url,
    uploadedBy: r.uploaded_by,
    createdAt: r.created_at,
  };
}

export async function insertAttachment(trx: Trx, a: NewAttachment): Promise<Attachment> {
  const row = await trx
    .insertInto("attachments")
    .values({
      request_id: a.requestId,
      kind: a.kind,
      file_name: a.fileName,
      content_type: a.contentType,
      size_bytes: a.sizeBytes,
      storage_key: a.storageKey,
      url: a.url,
      uploaded_by: a.uploadedBy,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  return toAttachment(row);
}

export async function listAttachments(db: Db | Trx, requestId: string): Promise<Attachment[]> {
  const rows = await db.selectFrom("attachments").selectAll().where("request_id", "=", requestId).orderBy("created_at").execute();
  return rows.map(toAttachment);
}

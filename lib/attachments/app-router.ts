/**
 * The attachment router as the app runs it: the signed-in PI (session cookie or API token),
 * the database, and the upload service's API (UTApi, configured from UPLOADTHING_* env
 * variables, so the same code reaches the real service or the local fake).
 */
import { UTApi } from "uploadthing/server";
import { getDb } from "@/db/index";
import { authenticate } from "@/lib/api/handler";
import { authorizeUpload, recordAttachment, UploadRefusedError } from "./service";
import { createAttachmentRouter } from "./router";
import { readStoredFile } from "./stored";

let utapi: UTApi | undefined;

export const attachmentRouter = createAttachmentRouter({
  async authorize(request, input) {
    const user = await authenticate(request).catch(() => null);
    await authorizeUpload(getDb(), user, input.requestId);
    return { userId: user!.id };
  },
  readStored: (url) => readStoredFile(url),
  async record(upload) {
    try {
      const saved = await recordAttachment(getDb(), {
        requestId: upload.requestId,
        kind: upload.kind,
        fileName: upload.fileName,
        contentType: upload.contentType,
        sizeBytes: upload.sizeBytes,
        storageKey: upload.storageKey,
        url: upload.url,
        uploadedBy: upload.userId,
      });
      return { id: saved.id, kind: saved.kind, fileName: saved.fileName, contentType: saved.contentType, sizeBytes: saved.sizeBytes, url: saved.url };
    } catch (error) {
      if (error instanceof UploadRefusedError) throw error;
      console.error("recording an attachment failed", error);
      throw new Error("The file arrived but could not be recorded. Try the upload again.");
    }
  },
  async discard(key) {
    // Created on first use: the constructor reads the environment, which `next build` may lack.
    utapi ??= new UTApi();
    await utapi.deleteFiles(key);
  },
});

/**
 * The UploadThing file router for request attachments, built from its dependencies so the
 * same router runs in the app (session, database, UTApi) and in tests (stand-ins).
 *
 * Steps: the middleware refuses oversize files and anyone but the request's PI before a
 * byte is sent; once stored, onUploadComplete reads the stored bytes back, checks them by
 * content, records the attachment, and answers `{ ok, … }` as serverData. A refused file
 * is deleted from storage and answered with a reason rather than an error, so the browser
 * can show the reason beside the upload and leave the rest of the form alone.
 */
import { createUploadthing, UploadThingError, type FileRouter } from "uploadthing/server";
import { z } from "zod";
import { ATTACHMENT_KINDS, type AttachmentKind } from "@/db/types";
import { checkAttachment, checkSize } from "./check";

export const uploadInputSchema = z.object({
  requestId: z.uuid("Save the draft before attaching files."),
  kind: z.enum(ATTACHMENT_KINDS),
});

// A type alias, not an interface: UploadThing needs serverData assignable to a JSON object.
export type StoredAttachment = {
  id: string;
  kind: AttachmentKind;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  url: string;
};

export type UploadAnswer = { ok: true; attachment: StoredAttachment } | { ok: false; fileName: string; reason: string };

export interface AttachmentRouterDeps {
  /** Who is uploading; throws with a message meant for them when they may not. */
  authorize: (request: Request, input: z.infer<typeof uploadInputSchema>) => Promise<{ userId: string }>;
  readStored: (url: string) => Promise<Uint8Array>;
  record: (upload: {
    requestId: string;
    kind: AttachmentKind;
    userId: string;
    fileName: string;
    contentType: string;
    sizeBytes: number;
    storageKey: string;
    url: string;
  }) => Promise<StoredAttachment>;
  /** Deletes a refused file from storage; failures are ignored (the record is what counts). */
  discard: (key: string) => Promise<void>;
}

const message = (error: unknown) => (error instanceof Error ? error.message : "The upload could not be completed.");

export function createAttachmentRouter(deps: AttachmentRouterDeps) {
  const f = createUploadthing();
  return {
    requestAttachment: f({ blob: { maxFileSize: "32MB", maxFileCount: 4 } }, { awaitServerData: true })
      .input(uploadInputSchema)
      .middleware(async ({ req, files, input }) => {
        for (const file of files) {
          const refused = checkSize(file.name, file.size);
          if (refused && !refused.ok) throw new UploadThingError({ code: "BAD_REQUEST", message: refused.reason });
        }
        let userId: string;
        try {
          ({ userId } = await deps.authorize(req, input));
        } catch (error) {
          throw new UploadThingError({ code: "FORBIDDEN", message: message(error) });
        }
        return { userId, requestId: input.requestId, kind: input.kind };
      })
      .onUploadComplete(async ({ metadata, file }): Promise<UploadAnswer> => {
        const refuse = async (fileName: string, reason: string): Promise<UploadAnswer> => {
          await deps.discard(file.key).catch(() => undefined);
          return { ok: false, fileName, reason };
        };
        const sized = checkSize(file.name, file.size);
        if (sized && !sized.ok) return refuse(sized.fileName, sized.reason);
        let bytes: Uint8Array;
        try {
          bytes = await deps.readStored(file.ufsUrl);
        } catch (error) {
          return refuse(file.name, message(error));
        }
        const verdict = checkAttachment(file.name, bytes);
        if (!verdict.ok) return refuse(verdict.fileName, verdict.reason);
        try {
          const attachment = await deps.record({
            requestId: metadata.requestId,
            kind: metadata.kind,
            userId: metadata.userId,
            fileName: verdict.fileName,
            contentType: verdict.contentType,
            sizeBytes: bytes.length,
            storageKey: file.key,
            url: file.ufsUrl,
          });
          return { ok: true, attachment };
        } catch (error) {
          return refuse(verdict.fileName, message(error));
        }
      }),
  } satisfies FileRouter;
}

export type AttachmentRouter = ReturnType<typeof createAttachmentRouter>;

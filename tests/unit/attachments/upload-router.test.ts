/**
 * The attachment router through the real UploadThing SDK against the local upload fake,
 * started in-process: the route handler in a node:http server, the browser uploader on
 * the other side. Session and database are stand-ins; the checks are the real ones.
 */
import { mkdtemp, readdir, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { genUploader } from "uploadthing/client";
import { createRouteHandler } from "uploadthing/server";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { createAttachmentRouter, type AttachmentRouter, type StoredAttachment } from "@/lib/attachments/router";
import { readStoredFile, StoredFileError } from "@/lib/attachments/stored";
import { describeUploadError } from "@/lib/attachments/upload-errors";
import { buildUploadThingToken, LOCAL_UPLOAD_API_KEY, LOCAL_UPLOAD_APP_ID } from "@/lib/uploads/token";
import { startUploadFake, type UploadFake } from "../../../scripts/fakes/upload-server";
import { installXhr, serveHandler, type App } from "./harness";

const REQUEST_ID = "11111111-1111-4111-8111-111111111111";
const NOT_YOURS = "22222222-2222-4222-8222-222222222222";
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

let root: string;
let fake: UploadFake;
let app: App;
let uninstall: () => void;
const recorded: Parameters<Parameters<typeof createAttachmentRouter>[0]["record"]>[0][] = [];
const discarded: string[] = [];

const router = createAttachmentRouter({
  async authorize(_request, input) {
    if (input.requestId === NOT_YOURS) throw new Error("That request does not exist, or it is not yours.");
    return { userId: "pi-1" };
  },
  readStored: (url) => readStoredFile(url),
  async record(upload): Promise<StoredAttachment> {
    recorded.push(upload);
    return { id: `att-${recorded.length}`, kind: upload.kind, fileName: upload.fileName, contentType: upload.contentType, sizeBytes: upload.sizeBytes, url: upload.url };
  },
  async discard(key) {
    discarded.push(key);
  },
});

function uploader() {
  return genUploader<AttachmentRouter>({ url: `${app.url}/api/uploadthing`, package: "nightbreak-test", fetch: globalThis.fetch }).uploadFiles;
}

async function upload(file: File, kind: "finding_chart" | "other" = "finding_chart", requestId = REQUEST_ID) {
  const [result] = await uploader()("requestAttachment", { files: [file], input: { requestId, kind } });
  if (!result) throw new Error("no result");
  return result.serverData;
}

beforeAll(async () => {
  uninstall = installXhr();
  root = await mkdtemp(join(tmpdir(), "nightbreak-attachments-"));
  fake = await startUploadFake({ port: 0, dir: join(root, "store"), apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID, callbackWaitMs: 5_000, registrationWaitMs: 5_000 });
  const token = buildUploadThingToken();
  // Production mode: the fake calls the app back, as the real service does.
  app = await serveHandler(createRouteHandler({ router, config: { token, ingestUrl: fake.url, isDev: false, logLevel: "Fatal" } }));
});

afterAll(async () => {
  await app.close();
  await fake.close();
  uninstall();
  await rm(root, { recursive: true, force: true });
});

beforeEach(() => {
  recorded.length = 0;
  discarded.length = 0;
});

describe("uploading an attachment", () => {
  it("stores a finding chart, checks the stored bytes, and records it", async () => {
    const answer = await upload(new File([PNG], "finding chart.png", { type: "image/png" }));
    expect(answer).toEqual({ ok: true, attachment: expect.objectContaining({ fileName: "finding chart.png", contentType: "image/png", sizeBytes: PNG.length }) });
    expect(recorded).toHaveLength(1);
    const served = await fetch(recorded[0]!.url);
    expect(new Uint8Array(await served.arrayBuffer())).toEqual(PNG);
  }, 20_000);

  it("refuses a file named .png whose content is text, deletes it, and says why", async () => {
    const answer = await upload(new File(["not an image at all"], "chart.png", { type: "image/png" }));
    expect(answer).toEqual({ ok: false, fileName: "chart.png", reason: "“chart.png” is named like a PNG image but its content is plain text or CSV." });
    expect(recorded).toEqual([]);
    expect(discarded).toHaveLength(1);
  }, 20_000);

  it("neutralises a name that tries to escape the storage folder", async () => {
    const answer = await upload(new File(["root:x:0:0:root:/root:/bin/sh\n"], "../../etc/passwd", { type: "text/plain" }), "other");
    expect(answer).toMatchObject({ ok: true, attachment: { fileName: "passwd.txt", contentType: "text/plain" } });
    expect(recorded[0]?.fileName).toBe("passwd.txt");
    // Nothing was written beside the store, and the store names files by its own ids.
    expect(await readdir(root)).toEqual(["store"]);
    for (const name of await readdir(join(root, "store", "objects"))) expect(name).toMatch(/^[0-9a-f-]{36}$/);
  }, 20_000);

  it("refuses a file over 20 MB before any byte is stored", async () => {
    const before = (await (await fetch(`${fake.url}/_files`)).json()) as { count: number };
    const big = new File([new Uint8Array(21 * 1024 * 1024)], "deep stack.fits", { type: "application/fits" });
    const failure = await upload(big).catch((e: unknown) => e);
    expect(describeUploadError(failure)).toBe("“deep stack.fits” is 21.0 MB; attachments may be at most 20 MB.");
    const after = (await (await fetch(`${fake.url}/_files`)).json()) as { count: number };
    expect(after.count).toBe(before.count);
  }, 20_000);

  it("refuses someone who may not attach to the request", async () => {
    const failure = await upload(new File([PNG], "chart.png", { type: "image/png" }), "finding_chart", NOT_YOURS).catch((e: unknown) => e);
    expect(describeUploadError(failure)).toBe("That request does not exist, or it is not yours.");
  }, 20_000);
});

describe("when the upload service is down", () => {
  it("fails the upload with a clear message, and says so when reading a stored file back", async () => {
    const down = await startUploadFake({ port: 0, dir: join(root, "down"), apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID });
    const downUrl = down.url;
    await down.close();
    const token = buildUploadThingToken();
    const orphan = await serveHandler(createRouteHandler({ router, config: { token, ingestUrl: downUrl, isDev: false, logLevel: "Fatal" } }));
    try {
      const uploadFiles = genUploader<AttachmentRouter>({ url: `${orphan.url}/api/uploadthing`, package: "nightbreak-test", fetch: globalThis.fetch }).uploadFiles;
      const failure = await uploadFiles("requestAttachment", { files: [new File(["x"], "note.txt", { type: "text/plain" })], input: { requestId: REQUEST_ID, kind: "other" } }).catch(
        (e: unknown) => e,
      );
      expect(describeUploadError(failure)).toBe(
        "The upload service is not answering, so the file was not stored. Everything you typed is kept: try the upload again in a moment.",
      );
      expect(recorded).toEqual([]);
    } finally {
      await orphan.close();
    }
    const reading = readStoredFile(`${downUrl}/f/some-key`);
    await expect(reading).rejects.toBeInstanceOf(StoredFileError);
    await expect(reading).rejects.toThrow(/could not be reached, so it could not be checked/);
  }, 30_000);
});

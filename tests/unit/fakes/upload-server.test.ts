/**
 * The local UploadThing fake, driven through the real `uploadthing` SDK: UTApi on the
 * server side, and createRouteHandler mounted in a plain node:http server with the
 * real `uploadthing/client` uploader on the other side. Node has no XMLHttpRequest,
 * which the client uses for the PUT, so a fetch-backed stand-in is installed (../attachments/harness.ts).
 */
import { createHmac } from "node:crypto";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { genUploader } from "uploadthing/client";
import { createRouteHandler, createUploadthing, UTApi, UTFile, type FileRouter } from "uploadthing/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { buildUploadThingToken, LOCAL_UPLOAD_API_KEY, LOCAL_UPLOAD_APP_ID, parseUploadThingToken } from "../../../lib/uploads/token";
import { startUploadFake, type StoredUpload, type UploadFake } from "../../../scripts/fakes/upload-server";
import { type App, installXhr, serveHandler } from "../attachments/harness";

const token = buildUploadThingToken();

/** Signs an ingest URL the way @uploadthing/shared's generateSignedURL does, written independently. */
function presign(base: string, key: string, data: Record<string, string | number>): string {
  const url = new URL(`${base}/${key}`);
  url.searchParams.append("expires", String(Date.now() + 60_000));
  for (const [name, value] of Object.entries(data)) url.searchParams.append(name, encodeURIComponent(value));
  const signature = `hmac-sha256=${createHmac("sha256", LOCAL_UPLOAD_API_KEY).update(url.toString()).digest("hex")}`;
  url.searchParams.append("signature", signature);
  return url.href;
}

function multipart(bytes: Uint8Array<ArrayBuffer>, name: string, type: string): FormData {
  const form = new FormData();
  form.append("file", new File([bytes], name, { type }));
  return form;
}

async function storedFiles(fake: UploadFake): Promise<(StoredUpload & { ufsUrl: string })[]> {
  const response = await fetch(`${fake.url}/_files`);
  return ((await response.json()) as { data: (StoredUpload & { ufsUrl: string })[] }).data;
}

let root: string;
let removeXhr: () => void;

beforeAll(async () => {
  root = await mkdtemp(join(tmpdir(), "nightbreak-upload-fake-"));
  removeXhr = installXhr();
});

afterAll(async () => {
  removeXhr();
  await rm(root, { recursive: true, force: true });
});

describe("lib/uploads/token", () => {
  it("builds a token the SDK accepts and that parses back", () => {
    expect(parseUploadThingToken(token)).toEqual({ apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID, regions: ["local-1"] });
    expect(() => buildUploadThingToken({ apiKey: "nope" })).toThrow(/sk_/);
  });
});

describe("upload fake with UTApi", () => {
  let fake: UploadFake;
  let dir: string;
  let utapi: UTApi;

  beforeAll(async () => {
    dir = join(root, "utapi");
    fake = await startUploadFake({ port: 0, dir, apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID });
    utapi = new UTApi({ token, apiUrl: fake.url, ingestUrl: fake.url, logLevel: "Error" });
  });
  afterAll(() => fake.close());

  it("uploads through a presigned PUT and serves the bytes back unchanged", async () => {
    const bytes = new Uint8Array(70_000).map((_, i) => (i * 31) % 256);
    const result = await utapi.uploadFiles(new UTFile([bytes], "finding-chart.png", { customId: "chart-1" }));
    expect(result.error).toBeNull();
    const data = result.data;
    if (data === null) throw new Error("upload failed");
    expect(data.ufsUrl).toBe(`${fake.url}/f/${data.key}`);
    expect(data.customId).toBe("chart-1");

    const served = await fetch(data.ufsUrl);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await served.arrayBuffer()).equals(Buffer.from(bytes))).toBe(true);

    const listed = await utapi.listFiles();
    expect(listed.files.map((f) => f.key)).toContain(data.key);
    const urls = await utapi.getFileUrls(data.key);
    expect(urls.data).toEqual([{ key: data.key, url: data.ufsUrl }]);

    const deleted = await utapi.deleteFiles(data.key);
    expect(deleted).toMatchObject({ success: true, deletedCount: 1 });
    expect((await fetch(data.ufsUrl)).status).toBe(404);
  });

  it("keeps a hostile file name out of the file system and out of headers", async () => {
    const hostile = '../../escape"\r\nX-Injected: 1.txt';
    const result = await utapi.uploadFiles(new UTFile(["plain text"], hostile, { type: "text/plain" }));
    const data = result.data;
    if (data === null) throw new Error("upload failed");
    expect(data.name).toBe(hostile);
    expect((await readdir(root)).sort()).toEqual(["utapi"]);
    expect((await readdir(dir)).sort()).toEqual(["objects", "records"]);
    for (const name of await readdir(join(dir, "objects"))) expect(name).toMatch(/^[0-9a-f-]{36}$/);

    const served = await fetch(data.ufsUrl);
    expect(served.headers.get("x-injected")).toBeNull();
    expect(served.headers.get("content-disposition")).toMatch(/^inline; filename="\.\._\.\._escape___X-Injected: 1\.txt"; filename\*=UTF-8''/);
    expect(served.headers.get("content-security-policy")).toBe("sandbox");
    expect(await served.text()).toBe("plain text");
  });

  it("hides private files behind signed URLs from requestFileAccess", async () => {
    const result = await utapi.uploadFiles(new UTFile(["secret"], "justification.txt"), { acl: "private" });
    const data = result.data;
    if (data === null) throw new Error("upload failed");
    expect((await fetch(data.ufsUrl)).status).toBe(403);
    const { ufsUrl } = await utapi.getSignedURL(data.key, { expiresIn: 60 });
    const served = await fetch(ufsUrl);
    expect(served.status).toBe(200);
    expect(await served.text()).toBe("secret");
  });

  it("refuses tampered presigned URLs and wrong API keys", async () => {
    const url = presign(fake.url, "abcDEF123", { "x-ut-identifier": LOCAL_UPLOAD_APP_ID, "x-ut-file-name": "a.txt", "x-ut-file-size": 1, "x-ut-file-type": "text/plain" });
    const tampered = url.replace("x-ut-file-size=1", "x-ut-file-size=2");
    const put = await fetch(tampered, { method: "PUT", body: multipart(new Uint8Array([65, 66]), "a.txt", "text/plain") });
    expect(put.status).toBe(403);

    const stranger = new UTApi({ token: buildUploadThingToken({ apiKey: "sk_someone_else" }), apiUrl: fake.url, ingestUrl: fake.url, logLevel: "Fatal" });
    await expect(stranger.listFiles()).rejects.toThrow();
    const strangerUpload = await stranger.uploadFiles(new UTFile(["x"], "x.txt"));
    expect(strangerUpload.error?.code).toBe("UPLOAD_FAILED");
  });

  it("refuses a body that does not match the size in the presigned URL", async () => {
    const url = presign(fake.url, "sizeKey1", { "x-ut-identifier": LOCAL_UPLOAD_APP_ID, "x-ut-file-name": "a.txt", "x-ut-file-size": 5, "x-ut-file-type": "text/plain" });
    const put = await fetch(url, { method: "PUT", body: multipart(new Uint8Array([65, 66]), "a.txt", "text/plain") });
    expect(put.status).toBe(400);
    expect(((await put.json()) as { error: string }).error).toMatch(/received 2 bytes/);
  });

  it("still serves stored files after a restart", async () => {
    const result = await utapi.uploadFiles(new UTFile(["kept"], "kept.txt"));
    const key = result.data?.key ?? "";
    await fake.close();
    fake = await startUploadFake({ port: 0, dir, apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID });
    utapi = new UTApi({ token, apiUrl: fake.url, ingestUrl: fake.url, logLevel: "Error" });
    expect(await (await fetch(`${fake.url}/f/${key}`)).text()).toBe("kept");
    expect((await utapi.listFiles()).files.map((f) => f.key)).toContain(key);
  });

  it("answers CORS preflight for browser uploads and exposes x-ut-range-start", async () => {
    const url = presign(fake.url, "corsKey1", { "x-ut-identifier": LOCAL_UPLOAD_APP_ID, "x-ut-file-name": "a.txt", "x-ut-file-size": 1, "x-ut-file-type": "text/plain" });
    const preflight = await fetch(url, {
      method: "OPTIONS",
      headers: { origin: "http://localhost:3000", "access-control-request-method": "PUT", "access-control-request-headers": "range,x-uploadthing-version,b3,traceparent" },
    });
    expect(preflight.status).toBe(204);
    expect(preflight.headers.get("access-control-allow-origin")).toBe("http://localhost:3000");
    expect(preflight.headers.get("access-control-allow-methods")).toContain("PUT");
    expect(preflight.headers.get("access-control-allow-headers")).toContain("range");
    const head = await fetch(url, { method: "HEAD", headers: { origin: "http://localhost:3000" } });
    expect(head.status).toBe(200);
    expect(head.headers.get("x-ut-range-start")).toBe("0");
    expect(head.headers.get("access-control-expose-headers")).toContain("x-ut-range-start");
  });
});

describe("upload fake: a PUT that arrives before its registration (dev stream)", () => {
  it("holds the PUT, streams the signed callback, and answers with the app's serverData", async () => {
    const fake = await startUploadFake({ port: 0, dir: join(root, "early"), apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID });
    try {
      const key = "earlyKey42";
      const url = presign(fake.url, key, {
        "x-ut-identifier": LOCAL_UPLOAD_APP_ID,
        "x-ut-file-name": "ephemeris table.csv",
        "x-ut-file-size": 11,
        "x-ut-file-type": "text/csv",
        "x-ut-slug": "ephemeris",
      });
      const put = fetch(url, { method: "PUT", headers: { range: "bytes=0-" }, body: multipart(new TextEncoder().encode("utc,ra,dec\n"), "x.csv", "text/csv") });
      // Wait until the fake holds the stored bytes, so the registration really comes second.
      for (let i = 0; i < 50 && !(await storedFiles(fake)).some((s) => s.key === key); i += 1) await new Promise((done) => setTimeout(done, 20));
      expect((await storedFiles(fake)).find((s) => s.key === key)?.callbackDone).toBe(false);

      const registration = await fetch(`${fake.url}/route-metadata`, {
        method: "POST",
        headers: { "x-uploadthing-api-key": LOCAL_UPLOAD_API_KEY, "content-type": "application/json" },
        body: JSON.stringify({ fileKeys: [key], metadata: { requestId: "req-9" }, isDev: true, callbackUrl: "http://127.0.0.1:9/api/uploadthing", callbackSlug: "ephemeris", awaitServerData: true }),
      });
      expect(registration.status).toBe(200);
      const reader = registration.body?.getReader();
      if (reader === undefined) throw new Error("no stream");
      const chunk = await reader.read();
      const line = JSON.parse(new TextDecoder().decode(chunk.value).trim()) as { payload: string; signature: string; hook: string };
      expect(line.hook).toBe("callback");
      expect(line.signature).toBe(`hmac-sha256=${createHmac("sha256", LOCAL_UPLOAD_API_KEY).update(line.payload).digest("hex")}`);
      const payload = JSON.parse(line.payload) as { file: { key: string; name: string; size: number }; origin: string; metadata: unknown };
      expect(payload).toMatchObject({ origin: fake.url, metadata: { requestId: "req-9" }, file: { key, name: "ephemeris table.csv", size: 11 } });

      const result = await fetch(`${payload.origin}/callback-result`, {
        method: "POST",
        headers: { "x-uploadthing-api-key": LOCAL_UPLOAD_API_KEY, "content-type": "application/json" },
        body: JSON.stringify({ fileKey: key, callbackData: { attachmentId: 5 } }),
      });
      expect(await result.json()).toEqual({ ok: true });
      const answer = (await (await put).json()) as { ufsUrl: string; serverData: unknown; fileHash: string };
      expect(answer.serverData).toEqual({ attachmentId: 5 });
      expect(answer.fileHash).toMatch(/^[0-9a-f]{32}$/);
      expect(await (await fetch(answer.ufsUrl)).text()).toBe("utc,ra,dec\n");
      expect((await reader.read()).done).toBe(true);
    } finally {
      await fake.close();
    }
  });
});

describe.each([
  { mode: "dev: held registration stream", isDev: true },
  { mode: "production: signed callback to the app", isDev: false },
])("route handler + client uploader against the fake ($mode)", ({ isDev }) => {
  const f = createUploadthing();
  const completed: { metadata: unknown; key: string; name: string }[] = [];
  const router = {
    attachment: f({ pdf: { maxFileSize: "4MB" }, image: { maxFileSize: "4MB" }, text: { maxFileSize: "1MB" } })
      .middleware(() => ({ userId: "pi-7" }))
      .onUploadComplete(({ metadata, file }) => {
        completed.push({ metadata, key: file.key, name: file.name });
        return { uploadedBy: metadata.userId };
      }),
    broken: f({ text: { maxFileSize: "1MB" } }).onUploadComplete(() => {
      throw new Error("database unavailable");
    }),
  } satisfies FileRouter;

  let fake: UploadFake;
  let app: App;

  beforeAll(async () => {
    fake = await startUploadFake({ port: 0, dir: join(root, isDev ? "dev" : "prod"), apiKey: LOCAL_UPLOAD_API_KEY, appId: LOCAL_UPLOAD_APP_ID, callbackWaitMs: 1_500 });
    const handler = createRouteHandler({ router, config: { token, ingestUrl: fake.url, isDev, logLevel: "Fatal" } });
    app = await serveHandler(handler);
  });
  afterAll(async () => {
    await app.close();
    await fake.close();
  });

  it("uploads through the app route, runs onUploadComplete, and returns its serverData", async () => {
    const { uploadFiles } = genUploader<typeof router>({ url: `${app.url}/api/uploadthing`, package: "nightbreak-test", fetch: globalThis.fetch });
    const chart = new Uint8Array(5_000).map((_, i) => (i * 7) % 256);
    const results = await uploadFiles("attachment", {
      files: [new File([chart], "finding chart.png", { type: "image/png" }), new File(["%PDF-1.4 justification"], "justification.pdf", { type: "application/pdf" })],
    });
    expect(results).toHaveLength(2);
    for (const result of results) expect(result.serverData).toEqual({ uploadedBy: "pi-7" });
    expect(completed.map((c) => c.name).sort()).toEqual(["finding chart.png", "justification.pdf"]);
    expect(completed.every((c) => JSON.stringify(c.metadata) === JSON.stringify({ userId: "pi-7" }))).toBe(true);

    const png = results.find((r) => r.name === "finding chart.png");
    if (png === undefined) throw new Error("missing result");
    const served = await fetch(png.ufsUrl);
    expect(Buffer.from(await served.arrayBuffer()).equals(Buffer.from(chart))).toBe(true);
    const stored = await storedFiles(fake);
    expect(stored.map((s) => s.slug)).toEqual(["attachment", "attachment"]);
    expect(stored.every((s) => s.callbackDone)).toBe(true);
  }, 15_000);

  it("fails the client's upload when onUploadComplete throws", async () => {
    const { uploadFiles } = genUploader<typeof router>({ url: `${app.url}/api/uploadthing`, package: "nightbreak-test", fetch: globalThis.fetch });
    await expect(uploadFiles("broken", { files: [new File(["x"], "note.txt", { type: "text/plain" })] })).rejects.toMatchObject({ code: "UPLOAD_FAILED", message: "XHR failed 502 Bad Gateway" });
  }, 15_000);
});

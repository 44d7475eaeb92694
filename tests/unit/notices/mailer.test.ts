// The Resend mailer against the local fake, through the real SDK: success, an idempotent
// replay, and how each kind of failure is sorted into "retry later" or "give up".
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { classifySendError, createResendMailer, type Mailer, type OutgoingEmail } from "@/lib/notices/mailer";
import { startEmailFake, type EmailFake } from "../../../scripts/fakes/email-server";

let dir: string;
let fake: EmailFake;
let mailer: Mailer;

const email: OutgoingEmail = {
  from: "Nightbreak override desk <desk@nightbreak.test>",
  to: "observer@nightbreak.test",
  subject: "Your AUR-114 block on AQ41 was shortened by 1 h 30 min",
  html: "<p>shortened</p>",
  text: "shortened",
  replyTo: "director@nightbreak.test",
  tags: [{ name: "event", value: "block_displaced" }],
};

async function control(body: Record<string, unknown>) {
  await fetch(`${fake.url}/_control`, { method: "POST", body: JSON.stringify(body) });
}

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "nightbreak-mailer-"));
  fake = await startEmailFake({ port: 0, dir });
  mailer = createResendMailer({ apiKey: "re_local_test", baseUrl: fake.url, timeoutMs: 5_000 });
});

afterAll(async () => {
  await fake.close();
  await rm(dir, { recursive: true, force: true });
});

beforeEach(() => control({ failRate: 0, failStatus: 500, failMode: "before-store", resetStats: true }));

describe("the Resend mailer", () => {
  it("sends with the idempotency key, reply-to and tags, and a repeated key returns the first message", async () => {
    const first = await mailer.send(email, "block_displaced:d-1:u-1");
    const again = await mailer.send(email, "block_displaced:d-1:u-1");
    expect(first).toMatchObject({ ok: true });
    expect(again).toEqual(first);
    const stored = (await (await fetch(`${fake.url}/_messages?to=observer@nightbreak.test`)).json()) as { data: Array<Record<string, unknown>> };
    const mine = stored.data.filter((m) => m.idempotency_key === "block_displaced:d-1:u-1");
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ reply_to: ["director@nightbreak.test"], tags: [{ name: "event", value: "block_displaced" }], text: "shortened" });
  });

  it("reports 500 and 429 as retryable", async () => {
    await control({ failRate: 1, failStatus: 500 });
    expect(await mailer.send(email, "k-500")).toMatchObject({ ok: false, retryable: true, status: 500 });
    await control({ failRate: 1, failStatus: 429 });
    expect(await mailer.send(email, "k-429")).toMatchObject({ ok: false, retryable: true, status: 429 });
  });

  it("reports a refused message (422) and a reused key with other content (409) as permanent", async () => {
    expect(await mailer.send({ ...email, to: " " }, "k-422")).toMatchObject({ ok: false, retryable: false, status: 422 });
    await mailer.send(email, "k-409");
    expect(await mailer.send({ ...email, subject: "something else" }, "k-409")).toMatchObject({ ok: false, retryable: false, status: 409 });
  });

  it("reports an unreachable service as retryable", async () => {
    const nowhere = createResendMailer({ apiKey: "re_local_test", baseUrl: "http://127.0.0.1:9", timeoutMs: 2_000 });
    expect(await nowhere.send(email, "k-net")).toMatchObject({ ok: false, retryable: true, status: null });
  });
});

describe("classifySendError", () => {
  it.each([
    [null, true],
    [408, true],
    [429, true],
    [500, true],
    [503, true],
    [400, false],
    [401, false],
    [403, false],
    [409, false],
    [422, false],
  ])("status %s → retryable %s", (statusCode, retryable) => {
    expect(classifySendError({ statusCode, name: "x", message: "y" }).retryable).toBe(retryable);
  });

  it("treats an error body without a status as retryable", () => {
    expect(classifySendError({}).retryable).toBe(true);
  });
});

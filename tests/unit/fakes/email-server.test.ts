// The local Resend fake, driven through the real `resend` SDK (no mocks).
import { mkdtemp, readdir, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Resend } from "resend";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { emailFaultsFromEnv, startEmailFake, type EmailFake, type StoredEmail } from "../../../scripts/fakes/email-server";

let dir: string;
let fake: EmailFake;
let resend: Resend;

const message = {
  from: "Nightbreak <desk@nightbreak.test>",
  to: ["observer@example.test"],
  subject: "Your block on the 2.4 m was displaced",
  html: "<p>Your block was shortened by 42 minutes.</p>",
  text: "Your block was shortened by 42 minutes.",
};

async function control(body: Record<string, unknown>): Promise<void> {
  const response = await fetch(`${fake.url}/_control`, { method: "POST", body: JSON.stringify(body) });
  expect(response.status).toBe(200);
}

async function listMessages(): Promise<StoredEmail[]> {
  const response = await fetch(`${fake.url}/_messages`);
  const body = (await response.json()) as { count: number; data: StoredEmail[] };
  expect(body.count).toBe(body.data.length);
  return body.data;
}

async function jsonFilesIn(folder: string): Promise<string[]> {
  return (await readdir(folder)).filter((name) => name.endsWith(".json"));
}

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "nightbreak-email-fake-"));
  fake = await startEmailFake({ port: 0, dir, faults: { failRate: 0, failStatus: 500, failMode: "before-store" } });
  resend = new Resend("re_local_test_key", { baseUrl: fake.url });
});

afterAll(async () => {
  await fake.close();
  await rm(dir, { recursive: true, force: true });
});

beforeEach(async () => {
  await control({ failRate: 0, failStatus: 500, failMode: "before-store", resetStats: true });
  await fetch(`${fake.url}/_messages`, { method: "DELETE" });
});

describe("email fake with the Resend SDK", () => {
  it("stores a sent message on disk and answers with its id", async () => {
    const { data, error } = await resend.emails.send({ ...message, tags: [{ name: "kind", value: "displacement" }] });
    expect(error).toBeNull();
    expect(data?.id).toMatch(/^[0-9a-f-]{36}$/);

    const onDisk = JSON.parse(await readFile(join(dir, `${data?.id ?? ""}.json`), "utf8")) as StoredEmail;
    expect(onDisk).toMatchObject({ id: data?.id, from: message.from, to: message.to, subject: message.subject, html: message.html, text: message.text });
    expect(onDisk.tags).toEqual([{ name: "kind", value: "displacement" }]);

    const listed = await listMessages();
    expect(listed.map((m) => m.id)).toEqual([data?.id]);
    const one = await fetch(`${fake.url}/_messages/${data?.id ?? ""}`);
    expect(((await one.json()) as StoredEmail).subject).toBe(message.subject);

    const fetched = await resend.emails.get(data?.id ?? "");
    expect(fetched.data?.subject).toBe(message.subject);
  });

  it("stores a message once when the same idempotency key is sent twice", async () => {
    const first = await resend.emails.send(message, { idempotencyKey: "notice-17" });
    const second = await resend.emails.send(message, { idempotencyKey: "notice-17" });
    expect(first.error).toBeNull();
    expect(second.data?.id).toBe(first.data?.id);
    expect(await listMessages()).toHaveLength(1);
    expect(await jsonFilesIn(dir)).toHaveLength(1);

    const conflicting = await resend.emails.send({ ...message, subject: "something else" }, { idempotencyKey: "notice-17" });
    expect(conflicting.error).toMatchObject({ statusCode: 409, name: "invalid_idempotent_request" });
  });

  it("rejects requests without a bearer key and invalid bodies with Resend-shaped errors", async () => {
    const anonymous = await fetch(`${fake.url}/emails`, { method: "POST", body: JSON.stringify(message) });
    expect(anonymous.status).toBe(401);
    expect(await anonymous.json()).toMatchObject({ statusCode: 401, name: "missing_api_key" });

    const { error } = await resend.emails.send({ from: message.from, to: message.to, subject: "", text: "x" });
    expect(error).toMatchObject({ statusCode: 422, name: "missing_required_field" });
    expect(await listMessages()).toHaveLength(0);
  });

  it.each([500, 429] as const)("fails with %i when told to, and stores nothing", async (status) => {
    await control({ failRate: 1, failStatus: status });
    const { data, error } = await resend.emails.send(message);
    expect(data).toBeNull();
    expect(error?.statusCode).toBe(status);
    expect(error?.name).toBe(status === 429 ? "rate_limit_exceeded" : "internal_server_error");
    expect(await listMessages()).toHaveLength(0);
  });

  it("in after-store mode keeps the message and lets a retry with the same key find it", async () => {
    await control({ failRate: 1, failStatus: 500, failMode: "after-store" });
    const lost = await resend.emails.send(message, { idempotencyKey: "notice-lost-answer" });
    expect(lost.error?.statusCode).toBe(500);
    await control({ failRate: 0 });
    const retried = await resend.emails.send(message, { idempotencyKey: "notice-lost-answer" });
    expect(retried.error).toBeNull();
    const stored = await listMessages();
    expect(stored).toHaveLength(1);
    expect(stored[0]?.id).toBe(retried.data?.id);
  });

  it("delivers a burst exactly once through 30% injected failures when the sender retries with keys", async () => {
    await control({ failRate: 0.3, failStatus: 429, failMode: "after-store" });
    const burst = 120;
    const ids = await Promise.all(
      Array.from({ length: burst }, async (_, n) => {
        for (let attempt = 0; attempt < 50; attempt += 1) {
          const { data } = await resend.emails.send({ ...message, subject: `notice ${n}` }, { idempotencyKey: `burst-${n}` });
          if (data !== null) return data.id;
        }
        throw new Error(`notice ${n} never got through`);
      }),
    );
    const stored = await listMessages();
    expect(stored).toHaveLength(burst);
    expect(new Set(stored.map((m) => m.idempotency_key)).size).toBe(burst);
    expect(new Set(ids)).toEqual(new Set(stored.map((m) => m.id)));
    const stats = (await (await fetch(`${fake.url}/_control`)).json()) as { stats: { injectedFailures: number } };
    expect(stats.stats.injectedFailures).toBeGreaterThan(0);
  });

  it("sends a batch, and replays it for the same key", async () => {
    const batch = [
      { ...message, to: ["a@example.test"] },
      { ...message, to: ["b@example.test"] },
    ];
    const first = await resend.batch.send(batch, { idempotencyKey: "batch-1" });
    expect(first.error).toBeNull();
    expect(first.data?.data).toHaveLength(2);
    const again = await resend.batch.send(batch, { idempotencyKey: "batch-1" });
    expect(again.data?.data).toEqual(first.data?.data);
    const stored = await listMessages();
    expect(stored.map((m) => m.to[0]).sort()).toEqual(["a@example.test", "b@example.test"]);

    const invalid = await resend.batch.send([{ ...message }, { ...message, to: [] }]);
    expect(invalid.error).toMatchObject({ statusCode: 422 });
    expect(await listMessages()).toHaveLength(2);
  });

  it("keeps messages and idempotency keys across a restart", async () => {
    const sent = await resend.emails.send(message, { idempotencyKey: "survives-restart" });
    await fake.close();
    fake = await startEmailFake({ port: 0, dir, faults: { failRate: 0 } });
    resend = new Resend("re_local_test_key", { baseUrl: fake.url });
    expect((await listMessages()).map((m) => m.id)).toEqual([sent.data?.id]);
    const replay = await resend.emails.send(message, { idempotencyKey: "survives-restart" });
    expect(replay.data?.id).toBe(sent.data?.id);
    expect(await listMessages()).toHaveLength(1);
  });

  it("reads fault settings from the environment", () => {
    expect(emailFaultsFromEnv({ FAKE_EMAIL_FAIL_RATE: "0.3", FAKE_EMAIL_FAIL_STATUS: "429" })).toEqual({ failRate: 0.3, failStatus: 429 });
    expect(() => emailFaultsFromEnv({ FAKE_EMAIL_FAIL_STATUS: "503" })).toThrow(/500 or 429/);
    expect(() => emailFaultsFromEnv({ FAKE_EMAIL_FAIL_RATE: "2" })).toThrow(/0 to 1/);
  });
});

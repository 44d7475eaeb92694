import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { logExecution } from "@/lib/tonight/execution-log";
import { getTonightQueue } from "@/lib/tonight/queue";
import { executionLogSchema } from "@/lib/tonight/schemas";
import { addApprovedRequest, addBlock, makeNightDesk, SANTIAGO_SITE } from "./helpers";
import { makeUser } from "../fixtures";

const NOW = new Date("2027-04-04T06:00:00Z");

async function tooNight() {
  const desk = await makeNightDesk(SANTIAGO_SITE);
  const requestId = await addApprovedRequest(desk, { name: "Fixture Afterglow 9", raDeg: 150, decDeg: -25 }, { start: "2027-04-03T20:00:00Z", end: "2027-04-04T10:00:00Z" });
  const tooBlock = await addBlock(desk, "2027-04-04T02:00:00Z", "2027-04-04T03:30:00Z", { kind: "too", tooRequestId: requestId });
  const science = await addBlock(desk, "2027-04-04T03:30:00Z", "2027-04-04T05:30:00Z");
  const assistant = { id: desk.assistant.id, roles: ["night_assistant" as const] };
  return { desk, requestId, tooBlock, science, assistant };
}

const parse = (v: unknown) => executionLogSchema.parse(v);

async function requestState(id: string) {
  return (await getDb().selectFrom("too_requests").select("state").where("id", "=", id).executeTakeFirstOrThrow()).state;
}

async function events(id: string) {
  return getDb().selectFrom("request_events").select(["from_state", "to_state", "actor_user_id", "note"]).where("request_id", "=", id).orderBy("id").execute();
}

describe("the night log", () => {
  it("settles an executed ToO request with a request event and audit rows in the same transaction", async () => {
    const s = await tooNight();
    const logged = await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "executed", minutesUsed: 85, note: "Clear, seeing 0.8″" }), NOW);
    expect(logged.request).toEqual({ id: s.requestId, from: "approved", to: "executed" });
    expect(await requestState(s.requestId)).toBe("executed");
    expect(await events(s.requestId)).toEqual([
      { from_state: "approved", to_state: "executed", actor_user_id: s.desk.assistant.id, note: "Night log: executed, 85 min — Clear, seeing 0.8″" },
    ]);
    const audit = await getDb().selectFrom("audit_log").select(["action", "entity_id"]).where("entity_id", "in", [s.tooBlock, s.requestId]).orderBy("id").execute();
    expect(audit).toEqual([
      { action: "block.execution", entity_id: s.tooBlock },
      { action: "request.settle", entity_id: s.requestId },
    ]);
    const queue = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, "2027-04-03", NOW);
    expect(queue.blocks[0]).toMatchObject({ state: "done", execution: { outcome: "executed", minutesUsed: 85 }, too: { requestState: "executed" } });
  });

  it("maps partial to partially executed and weather, technical or aborted to not executed; a later log corrects the outcome", async () => {
    const s = await tooNight();
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "partial", minutesUsed: 40 }), NOW);
    expect(await requestState(s.requestId)).toBe("partially_executed");
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "weather", note: "Dome closed: humidity" }), NOW);
    expect(await requestState(s.requestId)).toBe("not_executed");
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "technical" }), NOW);
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "aborted" }), NOW);
    expect(await requestState(s.requestId)).toBe("not_executed");
    expect((await events(s.requestId)).map((e) => `${e.from_state}→${e.to_state}`)).toEqual([
      "approved→partially_executed",
      "partially_executed→not_executed",
      "not_executed→not_executed",
      "not_executed→not_executed",
    ]);
    const queue = await getTonightQueue(getDb(), s.assistant, s.desk.telescopeCode, "2027-04-03", NOW);
    expect(queue.blocks[0]).toMatchObject({ state: "aborted", execution: { outcome: "aborted" } });
  });

  it("tells the PI, in the same transaction, that their ToO was lost to weather; a correction is a new notice", async () => {
    const s = await tooNight();
    const logged = await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "weather", note: "Dome closed: humidity" }), NOW);
    const notices = () =>
      getDb().selectFrom("notifications").select(["user_id", "event", "notice_key", "title", "body", "link"]).where("link", "=", `/requests/${s.requestId}`).orderBy("created_at").execute();
    const rows = await notices();
    expect(rows).toHaveLength(1);
    const [notice] = rows as [(typeof rows)[number]];
    expect(notice).toMatchObject({
      user_id: s.desk.pi.id,
      event: "outcome_logged",
      notice_key: `outcome_logged:${logged.id}:${s.desk.pi.id}`,
      title: "Your ToO override for Fixture Afterglow 9 on " + s.desk.telescopeCode + ": lost to weather",
      link: `/requests/${s.requestId}`,
    });
    expect(notice.body).toContain(`Your override for Fixture Afterglow 9 on ${s.desk.telescopeCode} was lost to weather; nothing was observed.`);
    expect(notice.body).toContain("2027-04-04 02:00–03:30 UT");
    expect(notice.body).toContain("Dome closed: humidity");
    const email = await getDb().selectFrom("email_deliveries").select(["user_id", "template"]).where("idempotency_key", "=", notice.notice_key).executeTakeFirst();
    expect(email).toEqual({ user_id: s.desk.pi.id, template: "outcome_logged" });

    // The night assistant corrects the log: the PI hears the new outcome too.
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "partial", minutesUsed: 40, note: "Opened again at 03:00 UT" }), NOW);
    expect((await notices()).map((n) => n.title.split(": ").at(-1))).toEqual(["lost to weather", "partially executed"]);
  });

  it("tells nobody when the log is refused, nor about a science block or a request outside the approved path", async () => {
    const s = await tooNight();
    await expect(logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "partial", minutesUsed: 91 }), NOW)).rejects.toThrow(/at most 90 minutes/);
    await logExecution(getDb(), s.assistant, s.science, parse({ outcome: "executed" }), NOW);
    await getDb().updateTable("too_requests").set({ state: "withdrawn" }).where("id", "=", s.requestId).execute();
    await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "aborted" }), NOW);
    expect(await getDb().selectFrom("notifications").select("id").where("user_id", "=", s.desk.pi.id).execute()).toEqual([]);
  });

  it("logs a science block without touching any request", async () => {
    const s = await tooNight();
    const logged = await logExecution(getDb(), s.assistant, s.science, parse({ outcome: "executed" }), NOW);
    expect(logged.request).toBeNull();
    expect(await requestState(s.requestId)).toBe("approved");
  });

  it("leaves a request outside the approved path as it is, but keeps the log", async () => {
    const s = await tooNight();
    await getDb().updateTable("too_requests").set({ state: "withdrawn" }).where("id", "=", s.requestId).execute();
    const logged = await logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "aborted" }), NOW);
    expect(logged.request).toBeNull();
    expect(await requestState(s.requestId)).toBe("withdrawn");
  });

  it("asks for minutes on a partial log, at most the block's length, and refuses observing a block not yet begun", () => {
    const partial = executionLogSchema.safeParse({ outcome: "partial", minutesUsed: "" });
    expect(partial.success).toBe(false);
    expect(partial.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["minutesUsed", "Say how many minutes were observed."]]);
    expect(executionLogSchema.safeParse({ outcome: "partial", minutesUsed: Number.NaN }).success).toBe(false);
    expect(executionLogSchema.safeParse({ outcome: "weather", minutesUsed: Number.NaN }).data).toEqual({ outcome: "weather", minutesUsed: null, note: "" });
    expect(executionLogSchema.safeParse({ outcome: "landed" }).success).toBe(false);
  });

  it("refuses impossible logs and leaves nothing behind", async () => {
    const s = await tooNight();
    await expect(logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "partial", minutesUsed: 91 }), NOW)).rejects.toThrow(/at most 90 minutes/);
    await expect(logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "executed" }), new Date("2027-04-04T01:00:00Z"))).rejects.toThrow(/has not started yet/);
    const stranger = await makeUser(["night_assistant"]);
    await expect(logExecution(getDb(), { id: stranger.id, roles: ["night_assistant"] }, s.tooBlock, parse({ outcome: "executed" }), NOW)).rejects.toThrow(/Only the night assistants of/);
    expect(await getDb().selectFrom("block_executions").select("id").where("block_id", "=", s.tooBlock).execute()).toEqual([]);
    expect(await requestState(s.requestId)).toBe("approved");
    // Weather may close the dome before a block begins: that can be logged ahead.
    await expect(logExecution(getDb(), s.assistant, s.tooBlock, parse({ outcome: "weather" }), new Date("2027-04-04T01:00:00Z"))).resolves.toMatchObject({ request: { to: "not_executed" } });
  });
});

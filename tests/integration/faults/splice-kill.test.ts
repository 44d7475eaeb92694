/**
 * The app process killed during a splice: the database shows all of the approval or none
 * of it. Each case starts approve-child.ts (a real approval through lib/decisions and
 * lib/splice, in a process of its own), holds it at one point inside its transaction,
 * SIGKILLs it there and lets the server finish whatever the dead client left behind.
 *
 * How the child is held: a trigger installed by this file (and dropped after it), active
 * only for the child's connection (found by application_name), takes a shared advisory
 * lock before a row goes into the table named by the case; the test holds that lock, so
 * the child waits inside its transaction with everything before that point written. The
 * first case holds the request row instead, the last one holds the COMMIT itself (a
 * deferred constraint trigger). pg_stat_activity and pg_locks confirm where the child is
 * before it is killed.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { sql } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { makeSubmittedRequest, makeWorld } from "../decisions/world";

const CHILD = path.join(__dirname, "approve-child.ts");
const CHILD_APP_NAME = "nightbreak-fault-approve";
const LOCK_CLASS = 7301;
const SLOT = { start: "2027-03-01T01:00:00Z", end: "2027-03-01T02:30:00Z" };
const NIGHT: Array<[string, string]> = [["2027-03-01T00:00:00Z", "2027-03-01T04:00:00Z"], ["2027-03-01T04:00:00Z", "2027-03-01T08:00:00Z"]];

type World = Awaited<ReturnType<typeof makeWorld>>;

interface HoldPoint {
  name: string;
  /** The advisory lock's second key, or "request" for the request row lock. */
  hold: number | "request";
  /** What the child is running while it waits. */
  statement: RegExp;
  /** Tables the child's transaction has written by then (RowExclusiveLock held). */
  written: string[];
  /** What the database must show after the kill. */
  outcome: "none" | "all";
}

const POINTS: HoldPoint[] = [
  { name: "locking the request, before any write", hold: "request", statement: /from "too_requests"/, written: [], outcome: "none" },
  { name: "splitting a block: first part trimmed, second not yet inserted", hold: 1, statement: /^insert into "blocks"/, written: ["blocks"], outcome: "none" },
  { name: "recording the displacement, ToO block inserted", hold: 2, statement: /^insert into "displacements"/, written: ["blocks", "displacements"], outcome: "none" },
  { name: "booking the ledger, splice done", hold: 3, statement: /^insert into "ledger_entries"/, written: ["blocks", "displacements", "ledger_entries"], outcome: "none" },
  {
    name: "logging the schedule change, request already marked approved",
    hold: 4,
    statement: /^insert into "schedule_changes"/,
    written: ["blocks", "displacements", "ledger_entries", "too_requests", "request_events", "request_decisions", "schedule_changes"],
    outcome: "none",
  },
  {
    name: "queueing the e-mails, in-app notices written",
    hold: 5,
    statement: /^insert into "email_deliveries"/,
    written: ["blocks", "displacements", "ledger_entries", "too_requests", "request_events", "request_decisions", "schedule_changes", "audit_log", "notifications", "email_deliveries"],
    outcome: "none",
  },
  // COMMIT was sent before the kill: the server finishes it, so all of it must be there.
  {
    name: "committing",
    hold: 6,
    statement: /^commit/i,
    written: ["blocks", "displacements", "ledger_entries", "too_requests", "request_events", "request_decisions", "schedule_changes", "audit_log", "notifications", "email_deliveries"],
    outcome: "all",
  },
];

let admin: pg.Client;
const children: ChildProcess[] = [];

beforeAll(async () => {
  admin = new pg.Client({ connectionString: process.env.DATABASE_URL, application_name: "nightbreak-fault-test" });
  await admin.connect();
  await admin.query(`
    create or replace function nightbreak_fault_hold() returns trigger language plpgsql as $$
    begin
      if current_setting('application_name') = '${CHILD_APP_NAME}' then
        perform pg_advisory_xact_lock_shared(${LOCK_CLASS}, TG_ARGV[0]::int);
      end if;
      return new;
    end $$`);
  const before = { blocks: 1, displacements: 2, ledger_entries: 3, schedule_changes: 4, email_deliveries: 5 };
  for (const [table, point] of Object.entries(before)) {
    await admin.query(`create trigger nightbreak_fault_hold before insert on ${table} for each row execute function nightbreak_fault_hold('${point}')`);
  }
  // Deferred: runs inside COMMIT, after every statement of the transaction.
  await admin.query(
    `create constraint trigger nightbreak_fault_hold after insert on audit_log deferrable initially deferred for each row execute function nightbreak_fault_hold('6')`,
  );
});

afterAll(async () => {
  for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
  for (const table of ["blocks", "displacements", "ledger_entries", "schedule_changes", "email_deliveries", "audit_log"]) {
    await admin.query(`drop trigger if exists nightbreak_fault_hold on ${table}`);
  }
  await admin.query("drop function if exists nightbreak_fault_hold()");
  await admin.end();
  await closeNoticeQueue();
});

function startApproval(world: World, requestId: string) {
  const child = spawn(process.execPath, ["--import", "tsx", CHILD, requestId, world.telescopeId, world.director.id, SLOT.start, SLOT.end], {
    cwd: process.cwd(),
    env: { ...process.env, PGAPPNAME: CHILD_APP_NAME },
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  let output = "";
  child.stdout?.on("data", (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on("data", (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  return { child, exited, output: () => output };
}

async function poll<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 45_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = await probe();
    if (found !== undefined) return found;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The child's connection while it waits for a lock, once it does. */
async function waitingChild(running: ReturnType<typeof startApproval>) {
  return poll("the child to wait inside its transaction", async () => {
    if (running.child.exitCode !== null) throw new Error(`the child ended (${running.child.exitCode}) before it was held:\n${running.output()}`);
    const { rows } = await admin.query<{ pid: number; query: string; in_transaction: boolean }>(
      `select pid, query, xact_start is not null as in_transaction from pg_stat_activity where application_name = $1 and wait_event_type = 'Lock'`,
      [CHILD_APP_NAME],
    );
    return rows[0];
  });
}

async function writtenTables(pid: number): Promise<string[]> {
  const { rows } = await admin.query<{ relname: string }>(
    `select distinct c.relname from pg_locks l join pg_class c on c.oid = l.relation join pg_namespace n on n.oid = c.relnamespace
     where l.pid = $1 and l.granted and l.mode = 'RowExclusiveLock' and c.relkind in ('r', 'p') and n.nspname = 'public' order by 1`,
    [pid],
  );
  return rows.map((r) => r.relname);
}

/** Everything an approval writes, for this world and request. */
async function footprint(world: World, requestId: string) {
  const db = getDb();
  const people = [world.piId, world.observer.id];
  const count = async (query: Promise<{ n: string | number | bigint } | undefined>) => Number((await query)?.n ?? 0);
  const request = await db.selectFrom("too_requests").select("state").where("id", "=", requestId).executeTakeFirstOrThrow();
  const blocks = await db.selectFrom("blocks").select(["id", "kind", "starts_at", "ends_at"]).where("telescope_id", "=", world.telescopeId).orderBy("starts_at").execute();
  const byRequest = async (table: "displacements" | "ledger_entries" | "request_events" | "request_decisions" | "schedule_changes") =>
    count(db.selectFrom(table).select((eb) => eb.fn.countAll<string>().as("n")).where("request_id", "=", requestId).executeTakeFirst());
  const { rows: jobs } = await sql<{ n: string }>`
    select case when to_regclass('pgboss.job') is null then 0
                else (select count(*) from pgboss.job where data->'to'->>'userId' in (${sql.join(people)})) end as n`.execute(db);
  return {
    state: request.state,
    blocks: blocks.map((b) => `${b.kind} ${b.starts_at.toISOString().slice(11, 16)}–${b.ends_at.toISOString().slice(11, 16)}`),
    blockIds: blocks.filter((b) => b.kind !== "too").map((b) => b.id),
    displacements: await byRequest("displacements"),
    ledgerEntries: await byRequest("ledger_entries"),
    requestEvents: await byRequest("request_events"),
    decisions: await byRequest("request_decisions"),
    scheduleChanges: await byRequest("schedule_changes"),
    audit: await count(db.selectFrom("audit_log").select((eb) => eb.fn.countAll<string>().as("n")).where("entity_id", "=", requestId).executeTakeFirst()),
    notices: await count(db.selectFrom("notifications").select((eb) => eb.fn.countAll<string>().as("n")).where("user_id", "in", people).executeTakeFirst()),
    emails: await count(db.selectFrom("email_deliveries").select((eb) => eb.fn.countAll<string>().as("n")).where("user_id", "in", people).executeTakeFirst()),
    jobs: Number(jobs[0]?.n ?? 0),
  };
}

const ALL = {
  state: "approved",
  blocks: ["science 00:00–01:00", "too 01:00–02:30", "science 02:30–04:00", "science 04:00–08:00"],
  displacements: 1,
  ledgerEntries: 2,
  requestEvents: 1,
  decisions: 1,
  scheduleChanges: 2,
  audit: 1,
  notices: 2, // the PI's decision, the observer's displaced block
  emails: 2,
  jobs: 2,
};

async function overlapsAnywhere(): Promise<number> {
  const { rows } = await sql<{ n: string }>`
    select count(*) as n from blocks a join blocks b
      on a.telescope_id = b.telescope_id and a.id < b.id
     and tstzrange(a.starts_at, a.ends_at, '[)') && tstzrange(b.starts_at, b.ends_at, '[)')`.execute(getDb());
  return Number(rows[0]?.n);
}

async function world(): Promise<{ world: World; requestId: string }> {
  const w = await makeWorld(NIGHT);
  return { world: w, requestId: await makeSubmittedRequest(w, "Killed-mid-splice comet") };
}

describe("an approval whose process is killed mid-transaction", () => {
  it("commits all of it when nothing gets in the way (the child works)", async () => {
    const { world: w, requestId } = await world();
    const running = startApproval(w, requestId);
    await running.exited;
    expect(running.child.exitCode, running.output()).toBe(0);
    expect(running.output()).toMatch(/^approved [0-9a-f-]{36}/m);
    expect(await footprint(w, requestId)).toMatchObject(ALL);
  }, 90_000);

  it.each(POINTS.map((p) => [p.name, p.outcome, p] as const))("killed while %s: the database shows %s of it", async (_name, _outcome, point) => {
    const { world: w, requestId } = await world();
    const before = await footprint(w, requestId);
    expect(before).toMatchObject({ state: "submitted", blocks: ["science 00:00–04:00", "science 04:00–08:00"], displacements: 0, notices: 0, jobs: 0 });

    const holder = new pg.Client({ connectionString: process.env.DATABASE_URL, application_name: "nightbreak-fault-holder" });
    await holder.connect();
    try {
      if (point.hold === "request") {
        await holder.query("begin");
        await holder.query("select id from too_requests where id = $1 for update", [requestId]);
      } else {
        await holder.query("select pg_advisory_lock($1, $2)", [LOCK_CLASS, point.hold]);
      }
      const running = startApproval(w, requestId);
      const held = await waitingChild(running);
      expect(held.in_transaction).toBe(true);
      expect(held.query.trim()).toMatch(point.statement);
      const written = await writtenTables(held.pid);
      expect(written).toEqual(expect.arrayContaining(point.written));
      if (point.written.length === 0) expect(written).toEqual([]);

      running.child.kill("SIGKILL");
      await running.exited;
      expect(running.child.signalCode).toBe("SIGKILL");
      expect(running.output()).not.toMatch(/^approved/m);
    } finally {
      // Let the server go on: it finds its client gone and ends the transaction its own way.
      await holder.end();
    }
    await poll("the killed child's connections to end", async () => {
      const { rows } = await admin.query<{ n: number }>("select count(*)::int as n from pg_stat_activity where application_name = $1", [CHILD_APP_NAME]);
      return rows[0]?.n === 0 ? true : undefined;
    });

    const after = await footprint(w, requestId);
    if (point.outcome === "none") expect(after).toEqual(before);
    else expect(after).toMatchObject(ALL);
    expect(await overlapsAnywhere()).toBe(0);
  }, 90_000);
});

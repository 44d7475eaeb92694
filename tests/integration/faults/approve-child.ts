/**
 * One approval, as a director's click makes it, in a process of its own: splice-kill.test.ts
 * starts this and SIGKILLs it in the middle of the approval's transaction.
 *
 * argv: requestId telescopeId directorUserId startIso endIso. Env: DATABASE_URL, and
 * PGAPPNAME so the test can find this process's connection in pg_stat_activity.
 * Prints "approved <tooBlockId>" once the transaction has committed.
 */
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { findUserById } from "@/lib/users/queries";

const [requestId, telescopeId, directorId, start, end] = process.argv.slice(2);
if (!requestId || !telescopeId || !directorId || !start || !end) throw new Error("usage: approve-child.ts requestId telescopeId directorUserId startIso endIso");

const db = getDb();
const director = await findUserById(db, directorId);
if (!director) throw new Error(`no user ${directorId}`);
const result = await approveRequest(db, director, { requestId, telescopeId, start: new Date(start), end: new Date(end), note: "Approved from a child process" });
console.log(`approved ${result.tooBlockId ?? ""}`);
await closeNoticeQueue();
await db.destroy();

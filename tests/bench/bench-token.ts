// Prints a fresh API token for a demo user (default the admin) in the bench database.
import { randomBytes } from "node:crypto";
import { createDb } from "../../db/index";
import { hashToken } from "../../lib/api-tokens/queries";

const email = process.argv[2] ?? "admin@nightbreak.test";
const db = createDb(process.env.DATABASE_URL ?? "", 1);
const user = await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow();
const token = `nbk_bench_${randomBytes(16).toString("hex")}`;
await db.insertInto("api_tokens").values({ user_id: user.id, name: "bench", token_prefix: token.slice(0, 12), token_hash: hashToken(token) }).execute();
await db.destroy();
console.log(token);

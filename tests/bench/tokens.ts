/** Fresh API tokens for demo users in the bench database (DATABASE_URL), one per e-mail. */
import { randomBytes } from "node:crypto";
import type autocannon from "autocannon";
import { createDb } from "../../db/index";
import { hashToken } from "../../lib/api-tokens/queries";

export async function makeBenchTokens(emails: string[]): Promise<string[]> {
  const db = createDb(process.env.DATABASE_URL ?? "", 1);
  try {
    const tokens: string[] = [];
    for (const email of emails) {
      const user = await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow();
      const token = `nbk_bench_${randomBytes(16).toString("hex")}`;
      await db.insertInto("api_tokens").values({ user_id: user.id, name: "bench", token_prefix: token.slice(0, 12), token_hash: hashToken(token) }).execute();
      tokens.push(token);
    }
    return tokens;
  } finally {
    await db.destroy();
  }
}

/** autocannon requests that take turns with the tokens, as many viewers polling at once would. */
export function rotatingViewers(tokens: string[]): autocannon.Request[] {
  let next = 0;
  return [
    {
      setupRequest: (request: autocannon.Request) => {
        const token = tokens[next++ % tokens.length];
        return { ...request, headers: { ...request.headers, authorization: `Bearer ${token}` } };
      },
    },
  ];
}

/** The demo users who read tonight's queue: the night assistant, a director, an observer and an admin. */
export const QUEUE_VIEWERS = ["night@nightbreak.test", "director@nightbreak.test", "observer@nightbreak.test", "admin@nightbreak.test"];

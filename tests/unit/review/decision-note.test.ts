// The director's note is kept in the request's history too (at most 2000 characters there):
// the decision schema refuses a longer one with a message instead of a database error.
import { describe, expect, it } from "vitest";
import { decisionSchema } from "@/lib/review/schemas";

describe("the decision note's length", () => {
  it.each(["return", "decline"] as const)("accepts 2000 characters and refuses 2001 on %s", (decision) => {
    const field = decision === "return" ? "note" : "reason";
    expect(decisionSchema.safeParse({ decision, [field]: "x".repeat(2000) }).success).toBe(true);
    const refused = decisionSchema.safeParse({ decision, [field]: "x".repeat(2001) });
    expect(refused.success).toBe(false);
    expect(refused.error?.issues[0]?.message).toMatch(/under 2000 characters/);
  });
});

/**
 * The password rules (lib/auth/password.ts): length only, 12 to 200 characters, no
 * composition rules (NIST SP 800-63B), shared by the admin form and the API through
 * createUserSchema. tests/integration/trust/password-rules.test.ts checks them end to end.
 */
import { describe, expect, it } from "vitest";
import { passwordSchema } from "@/lib/auth/password";
import { createUserSchema } from "@/lib/users/schemas";

const message = (value: string) => passwordSchema.safeParse(value).error?.issues[0]?.message;

describe("the password rules", () => {
  it("asks for at least 12 characters and at most 200", () => {
    expect(message("a".repeat(11))).toBe("Use at least 12 characters.");
    expect(message("")).toBe("Use at least 12 characters.");
    expect(passwordSchema.safeParse("a".repeat(12)).success).toBe(true);
    expect(passwordSchema.safeParse("a".repeat(200)).success).toBe(true);
    expect(message("a".repeat(201))).toBe("Use at most 200 characters.");
  });

  it("sets no composition rules: a long passphrase of plain words will do", () => {
    for (const phrase of ["correct horse battery", "ñandú bajo la cruz del sur", "twelve chars"]) {
      expect(passwordSchema.safeParse(phrase).success, phrase).toBe(true);
    }
  });

  it("keeps the password as typed: no trimming, no case folding", () => {
    expect(passwordSchema.parse("  Spaces Count  ")).toBe("  Spaces Count  ");
  });

  it("is the rule the user form and the API use", () => {
    const base = { name: "New Person", email: "new@fixture.test", roles: ["pi"] };
    const short = createUserSchema.safeParse({ ...base, password: "too short" });
    expect(short.success).toBe(false);
    expect(short.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["password", "Use at least 12 characters."]]);
    expect(createUserSchema.safeParse({ ...base, password: "long enough now" }).success).toBe(true);
  });
});

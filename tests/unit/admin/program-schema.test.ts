import { describe, expect, it } from "vitest";
import { emptyProgramForm, programSchema } from "@/lib/programs/schemas";

const id = (n: number) => `00000000-0000-4000-8000-00000000000${n}`;
const valid = { ...emptyProgramForm, code: "SCI-101", title: "Dust lanes", semesterId: id(1), partnerId: id(2), piUserId: id(3), allocatedHours: "60" };

const errorsOf = (input: unknown) => {
  const r = programSchema.safeParse(input);
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("the program schema", () => {
  it("parses a filled-in form", () => {
    expect(programSchema.parse({ ...valid, observerUserIds: [id(4)] })).toMatchObject({ rank: 3, allocatedHours: 60, category: "science", tooAllowed: false, observerUserIds: [id(4)] });
  });

  it("keeps rank a whole number from 1 to 5", () => {
    for (const rank of ["0", "6", "2.5"]) expect(errorsOf({ ...valid, rank }).rank).toMatch(/1 \(highest\) to 5/);
    expect(programSchema.parse({ ...valid, rank: "1" }).rank).toBe(1);
  });

  it("refuses negative hours, unknown categories and unchosen people", () => {
    expect(errorsOf({ ...valid, allocatedHours: "-1", category: "bonus", piUserId: "", semesterId: "", partnerId: "" })).toEqual({
      allocatedHours: "Give the allocated hours, from 0 to 5000.",
      category: "Choose a category.",
      piUserId: "Choose the PI.",
      semesterId: "Choose the semester.",
      partnerId: "Choose the partner.",
    });
  });

  it("takes every category the schedule knows", () => {
    for (const category of ["science", "engineering", "discretionary", "too", "payback"]) expect(programSchema.safeParse({ ...valid, category }).success).toBe(true);
  });
});

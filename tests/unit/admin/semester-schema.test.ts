import { describe, expect, it } from "vitest";
import { semesterFormValues, semesterSchema } from "@/lib/semesters/schemas";

describe("the semester schema", () => {
  it("reads start and end as UT instants", () => {
    expect(semesterSchema.parse({ code: "2027A", startsAt: "2027-02-01T00:00", endsAt: "2027-08-01T00:00" })).toEqual({
      code: "2027A",
      startsAt: new Date("2027-02-01T00:00:00Z"),
      endsAt: new Date("2027-08-01T00:00:00Z"),
    });
  });

  it("refuses an end before (or at) the start, beside the end field", () => {
    for (const endsAt of ["2027-01-31T23:59", "2027-02-01T00:00"]) {
      const r = semesterSchema.safeParse({ code: "2027A", startsAt: "2027-02-01T00:00", endsAt });
      expect(r.success).toBe(false);
      expect(r.error?.issues).toEqual([expect.objectContaining({ path: ["endsAt"], message: "The semester must end after it starts." })]);
    }
  });

  it("asks for missing dates by name", () => {
    const r = semesterSchema.safeParse({ code: "2027A", startsAt: "", endsAt: "" });
    expect(r.error?.issues.map((i) => i.message)).toEqual(["Enter when the semester starts (UT).", "Enter when the semester ends (UT)."]);
  });

  it("fills the edit form in UT", () => {
    const values = semesterFormValues({ id: "x", code: "2027B", startsAt: new Date("2027-08-01T00:00:00Z"), endsAt: new Date("2028-02-01T12:00:00Z"), programCount: 0 });
    expect(values).toEqual({ code: "2027B", startsAt: "2027-08-01T00:00", endsAt: "2028-02-01T12:00" });
  });
});

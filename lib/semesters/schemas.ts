import { z } from "zod";
import { codeField, toUtInputValue, utInstantField } from "@/lib/validation/fields";
import type { Semester } from "./queries";

/** A semester is the half-open UTC interval [startsAt, endsAt). */
export const semesterSchema = z
  .object({
    code: codeField("semester"),
    startsAt: utInstantField("Enter when the semester starts (UT)."),
    endsAt: utInstantField("Enter when the semester ends (UT)."),
  })
  .refine((s) => s.endsAt > s.startsAt, { message: "The semester must end after it starts.", path: ["endsAt"] });

export type SemesterFormValues = z.input<typeof semesterSchema>;
export type SemesterInput = z.output<typeof semesterSchema>;

export const emptySemesterForm: SemesterFormValues = { code: "", startsAt: "", endsAt: "" };

export function semesterFormValues(s: Semester): SemesterFormValues {
  return { code: s.code, startsAt: toUtInputValue(s.startsAt), endsAt: toUtInputValue(s.endsAt) };
}

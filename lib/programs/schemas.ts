import { z } from "zod";
import { BLOCK_KINDS, type BlockKind } from "@/db/types";
import { codeField, idField, idListField, numberField, textField } from "@/lib/validation/fields";
import type { Program } from "./queries";

export const PROGRAM_CATEGORIES = BLOCK_KINDS;

export const CATEGORY_LABELS: Record<BlockKind, string> = {
  science: "Science",
  engineering: "Engineering",
  discretionary: "Discretionary",
  too: "ToO",
  payback: "Payback",
};

export const programSchema = z.object({
  code: codeField("program"),
  title: textField("Enter the program's title.", 300),
  semesterId: idField("Choose the semester."),
  partnerId: idField("Choose the partner."),
  piUserId: idField("Choose the PI."),
  // 1 is the committee's highest rank; the slot finder displaces low ranks first.
  rank: numberField({ required: "Enter the rank.", min: 1, max: 5, integer: true, range: "The rank is a whole number from 1 (highest) to 5." }),
  allocatedHours: numberField({ required: "Enter the allocated hours.", min: 0, max: 5000, range: "Give the allocated hours, from 0 to 5000." }),
  category: z.enum(PROGRAM_CATEGORIES, { error: "Choose a category." }),
  tooAllowed: z.boolean({ error: "Say whether ToO requests are allowed." }),
  observerUserIds: idListField("Choose observers from the list."),
});

export type ProgramFormValues = z.input<typeof programSchema>;
export type ProgramInput = z.output<typeof programSchema>;

export const emptyProgramForm: ProgramFormValues = {
  code: "",
  title: "",
  semesterId: "",
  partnerId: "",
  piUserId: "",
  rank: "3",
  allocatedHours: "",
  category: "science",
  tooAllowed: false,
  observerUserIds: [],
};

export function programFormValues(p: Program): ProgramFormValues {
  return {
    code: p.code,
    title: p.title,
    semesterId: p.semesterId,
    partnerId: p.partnerId,
    piUserId: p.piUserId,
    rank: String(p.rank),
    allocatedHours: String(p.allocatedHours),
    category: p.category,
    tooAllowed: p.tooAllowed,
    observerUserIds: p.observers.map((o) => o.id),
  };
}

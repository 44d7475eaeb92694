import { z } from "zod";
import { codeField, idField, numberField, textField } from "@/lib/validation/fields";
import type { Instrument } from "./queries";

export const instrumentSchema = z.object({
  telescopeId: idField("Choose the telescope it is mounted on."),
  code: codeField("instrument"),
  name: textField("Enter the instrument's name."),
  // The faintest magnitude it reaches in a typical exposure; the fading clock compares against it.
  limitingMagnitude: numberField({ required: "Enter the limiting magnitude.", min: 0, max: 35, range: "Give a limiting magnitude between 0 and 35." }),
});

export type InstrumentFormValues = z.input<typeof instrumentSchema>;
export type InstrumentInput = z.output<typeof instrumentSchema>;

export const emptyInstrumentForm: InstrumentFormValues = { telescopeId: "", code: "", name: "", limitingMagnitude: "" };

export function instrumentFormValues(i: Instrument): InstrumentFormValues {
  return { telescopeId: i.telescopeId, code: i.code, name: i.name, limitingMagnitude: String(i.limitingMagnitude) };
}

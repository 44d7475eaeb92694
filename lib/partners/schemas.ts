import { z } from "zod";
import { codeField, textField } from "@/lib/validation/fields";
import type { Partner } from "./queries";

export const partnerSchema = z.object({
  code: codeField("partner"),
  name: textField("Enter the partner's name."),
});

export type PartnerFormValues = z.input<typeof partnerSchema>;
export type PartnerInput = z.output<typeof partnerSchema>;

export const emptyPartnerForm: PartnerFormValues = { code: "", name: "" };

export function partnerFormValues(p: Partner): PartnerFormValues {
  return { code: p.code, name: p.name };
}

import { z } from "zod";
import { codeField, numberField, textField } from "@/lib/validation/fields";
import { canonicalTimeZone } from "./time-zone";
import type { Site } from "./queries";

const TIME_ZONE_HINT = "an IANA name such as America/Santiago or Europe/Madrid";

export const siteSchema = z.object({
  code: codeField("site"),
  name: textField("Enter the site's name."),
  // The database keeps longitude in (−180, 180], east positive.
  latitudeDeg: numberField({ required: "Enter the latitude.", min: -90, max: 90, range: "Latitude runs from −90 (south pole) to 90 (north pole)." }),
  longitudeDeg: numberField({
    required: "Enter the east longitude.",
    min: -180,
    max: 180,
    minExclusive: true,
    range: "East longitude runs from above −180 to 180; west of Greenwich is negative.",
  }),
  heightM: numberField({ required: "Enter the height above sea level.", min: -500, max: 9000, range: "Give the height in metres, between −500 and 9000." }),
  timeZone: z
    .string({ error: `Enter the time zone, ${TIME_ZONE_HINT}.` })
    .trim()
    .min(1, `Enter the time zone, ${TIME_ZONE_HINT}.`)
    .transform((name, ctx) => {
      const zone = canonicalTimeZone(name);
      if (!zone) ctx.addIssue({ code: "custom", message: `Unknown time zone “${name}”: use ${TIME_ZONE_HINT}.` });
      return zone ?? name;
    }),
});

export type SiteFormValues = z.input<typeof siteSchema>;
export type SiteInput = z.output<typeof siteSchema>;

export const emptySiteForm: SiteFormValues = { code: "", name: "", latitudeDeg: "", longitudeDeg: "", heightM: "", timeZone: "" };

export function siteFormValues(site: Site): SiteFormValues {
  return {
    code: site.code,
    name: site.name,
    latitudeDeg: String(site.latitudeDeg),
    longitudeDeg: String(site.longitudeDeg),
    heightM: String(site.heightM),
    timeZone: site.timeZone,
  };
}

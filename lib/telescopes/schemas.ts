import { z } from "zod";
import { codeField, idField, idListField, numberField, textField } from "@/lib/validation/fields";
import type { Telescope } from "./queries";

/** Pointing limits are in degrees and hours of hour angle (west positive). */
export const telescopeSchema = z.object({
  siteId: idField("Choose the site."),
  code: codeField("telescope"),
  name: textField("Enter the telescope's name."),
  apertureM: numberField({ required: "Enter the aperture.", min: 0, max: 50, minExclusive: true, range: "Give the aperture in metres, above 0 and at most 50." }),
  minAltitudeDeg: numberField({ required: "Enter the lowest altitude.", min: 0, max: 90, range: "The lowest altitude is between 0° and 90°." }),
  maxAirmass: numberField({ required: "Enter the highest airmass.", min: 1, max: 10, range: "Airmass is 1 at the zenith: give a highest airmass from 1 to 10." }),
  sunAvoidanceDeg: numberField({ required: "Enter the sun-avoidance angle.", min: 0, max: 180, range: "The sun-avoidance angle is between 0° and 180°." }),
  hourAngleMinH: numberField({ required: "Enter the eastern hour-angle limit.", min: -12, max: 0, range: "The eastern limit is between −12 h and 0 h." }),
  hourAngleMaxH: numberField({ required: "Enter the western hour-angle limit.", min: 0, max: 12, range: "The western limit is between 0 h and 12 h." }),
  setupMinutes: numberField({ required: "Enter the setup time.", min: 0, max: 600, integer: true, range: "Give whole minutes, from 0 to 600." }),
  assistantUserIds: idListField("Choose night assistants from the list."),
});

export type TelescopeFormValues = z.input<typeof telescopeSchema>;
export type TelescopeInput = z.output<typeof telescopeSchema>;

// The schema's defaults for a new telescope, as the database has them.
export const emptyTelescopeForm: TelescopeFormValues = {
  siteId: "",
  code: "",
  name: "",
  apertureM: "",
  minAltitudeDeg: "20",
  maxAirmass: "2.9",
  sunAvoidanceDeg: "45",
  hourAngleMinH: "-12",
  hourAngleMaxH: "12",
  setupMinutes: "10",
  assistantUserIds: [],
};

export function telescopeFormValues(t: Telescope): TelescopeFormValues {
  return {
    siteId: t.siteId,
    code: t.code,
    name: t.name,
    apertureM: String(t.apertureM),
    minAltitudeDeg: String(t.minAltitudeDeg),
    maxAirmass: String(t.maxAirmass),
    sunAvoidanceDeg: String(t.sunAvoidanceDeg),
    hourAngleMinH: String(t.hourAngleMinH),
    hourAngleMaxH: String(t.hourAngleMaxH),
    setupMinutes: String(t.setupMinutes),
    assistantUserIds: t.assistants.map((a) => a.id),
  };
}

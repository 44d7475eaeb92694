/**
 * The feasibility report for a ToO request: per acceptable telescope, the observable
 * windows inside the request's horizon (from max(earliest start, now) to the earliest of
 * latest end, deadline and the fading clock's fade past the instrument's limit) and a
 * verdict; per site, the sky of the first nights for the airmass charts; and the fading clock. Instants are ISO 8601 UTC strings (chart samples:
 * epoch milliseconds, in parallel arrays) so the report crosses the wire and the database unchanged.
 *
 * The zod schemas describe the report in the OpenAPI document; the types come from them.
 */
import { z } from "zod";

const instant = z.string().meta({ format: "date-time" });
const sunStatus = z.enum(["clear", "restricted", "refused"]);
const moment = z.object({ utc: instant, local: z.string() }).nullable();

export const feasibilityWindowSchema = z.object({
  start: instant,
  end: instant,
  durationMinutes: z.number(),
  bestAirmass: z.number().nullable(),
});

export const feasibilityNightSchema = z.object({
  nightOf: z.string().meta({ description: "The site's local date on which the night begins." }),
  windows: z.array(feasibilityWindowSchema).meta({ description: "Observable windows clipped to the request's horizon." }),
  observableMinutes: z.number(),
  bestAirmass: z.number().nullable(),
  moonIllumination: z.number(),
  moonClosestDeg: z.number().nullable(),
  sunAvoidance: sunStatus,
  sunAvoidanceReason: z.string(),
  notes: z.array(z.string()),
});

export const telescopeFeasibilitySchema = z.object({
  telescopeId: z.string(),
  code: z.string(),
  name: z.string(),
  siteId: z.string(),
  siteName: z.string(),
  timeZone: z.string(),
  verdict: z.enum(["feasible", "no_window", "sun_refused"]),
  reason: z.string(),
  airmassLimit: z.number().meta({ description: "The stricter of the telescope's and the request's limits." }),
  minAltitudeDeg: z.number(),
  sunAvoidanceDeg: z.number(),
  sunAvoidance: z.object({ status: sunStatus, reason: z.string() }),
  longestWindowMinutes: z.number(),
  firstSlot: feasibilityWindowSchema.nullable().meta({ description: "The first window long enough for the request." }),
  nights: z.array(feasibilityNightSchema),
});

export const skyNightSchema = z.object({
  nightOf: z.string(),
  twilight: z.object({
    sunset: moment,
    civilDusk: moment,
    nauticalDusk: moment,
    astronomicalDusk: moment,
    astronomicalDawn: moment,
    nauticalDawn: moment,
    civilDawn: moment,
    sunrise: moment,
    solarMidnight: z.object({ utc: instant, local: z.string() }),
    sunAltitudeAtMidnightDeg: z.number(),
  }),
  moonIllumination: z.number(),
  samples: z
    .object({
      t: z.array(z.number()).meta({ description: "Epoch milliseconds, UTC." }),
      airmass: z.array(z.number().nullable()),
      altitudeDeg: z.array(z.number().nullable()),
      moonAltitudeDeg: z.array(z.number()),
      sunAltitudeDeg: z.array(z.number()),
    })
    .meta({ description: "The night sampled every 10 minutes as parallel arrays: entry i of each belongs to t[i]." }),
});

export const siteSkySchema = z.object({ siteId: z.string(), siteName: z.string(), timeZone: z.string(), nights: z.array(skyNightSchema) });

export const fadingSummarySchema = z.object({
  source: z.enum(["H-G", "ephemeris"]),
  instrument: z.string(),
  limitingMagnitude: z.number(),
  magnitudeAtStart: z.number().nullable(),
  fainterThanLimitAt: instant.nullable(),
  alreadyFainter: z.boolean(),
  coverageEnd: instant,
  reason: z.string(),
  curve: z.array(z.object({ t: z.number(), magnitude: z.number() })),
});

export const feasibilityHorizonSchema = z.object({ start: instant, end: instant }).meta({
  description: "The time in which windows count: from max(earliest start, now) to the earliest of latest end, deadline and the instant the target fades past the instrument's limit.",
});

export const feasibilityReportSchema = z
  .object({
    computedAt: instant,
    horizon: feasibilityHorizonSchema,
    durationMinutes: z.number(),
    verdict: z.enum(["feasible", "refused"]),
    reasons: z.array(z.string()).meta({ description: "Why it would be refused (empty when feasible); each names the telescope concerned." }),
    telescopes: z.array(telescopeFeasibilitySchema),
    skies: z.array(siteSkySchema).meta({ description: "Per site, the sky of the first nights, for airmass charts." }),
    fading: fadingSummarySchema.nullable(),
    notes: z.array(z.string()),
    disclaimer: z.string(),
  })
  .meta({ id: "FeasibilityReport" });

export type FeasibilityWindow = z.infer<typeof feasibilityWindowSchema>;
export type FeasibilityNight = z.infer<typeof feasibilityNightSchema>;
export type TelescopeVerdict = z.infer<typeof telescopeFeasibilitySchema>["verdict"];
export type TelescopeFeasibility = z.infer<typeof telescopeFeasibilitySchema>;
export type SkyNight = z.infer<typeof skyNightSchema>;
export type SiteSky = z.infer<typeof siteSkySchema>;
export type FadingSummary = z.infer<typeof fadingSummarySchema>;
export type FeasibilityReport = z.infer<typeof feasibilityReportSchema>;

/** What is kept with a request when it is filed: the report without the chart samples. */
export type FeasibilitySnapshot = Omit<FeasibilityReport, "skies" | "fading"> & {
  fading: Omit<FadingSummary, "curve"> | null;
};

/** A telescope as the sky engine needs it, with its site. */
export interface TelescopeSky {
  id: string;
  code: string;
  name: string;
  minAltitudeDeg: number;
  maxAirmass: number;
  sunAvoidanceDeg: number;
  hourAngleMinH: number;
  hourAngleMaxH: number;
  site: { id: string; code: string; name: string; latitudeDeg: number; longitudeDeg: number; heightM: number; timeZone: string };
}

export interface InstrumentRef {
  id: string;
  telescopeId: string;
  code: string;
  name: string;
  limitingMagnitude: number;
}

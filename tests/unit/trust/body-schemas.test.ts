/**
 * Bad input to the API's body schemas, generated: whatever JSON arrives — anything at all,
 * or a valid body with one field swapped for anything — `safeParse` answers with a result,
 * never an exception, and a failure is a ZodError whose issues the API can name field by
 * field (the 400 body). A throw from a transform or refinement would be a 500 instead.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ZodError, type ZodType } from "zod";
import { zodFields } from "@/lib/api/errors";
import { emptyRequestForm } from "@/lib/requests/form-values";
import { requestSchema } from "@/lib/requests/schemas";
import { decisionSchema } from "@/lib/review/schemas";
import { blockInputSchema, blockPatchSchema } from "@/lib/schedule/schemas";
import { parseVisibilityRequest, visibilityRequestSchema } from "@/lib/visibility";

const ID = "00000000-0000-4000-8000-000000000001";
const NOW = new Date("2027-03-10T15:02:00Z");

const requestBody = {
  ...emptyRequestForm(NOW, [ID]),
  targetName: "Invented transient",
  target: { kind: "fixed", ra: "05 35 17.3", dec: "-05 23 28" },
  telescopeIds: [ID],
  instrumentId: ID,
  justification: "Photometry before it fades below reach of the 1.6 m.",
};
const blockBody = { telescopeId: ID, programId: ID, kind: "science", startsAt: "2027-02-10T01:00:00Z", endsAt: "2027-02-10T04:00:00Z", notes: "" };
const decisionBody = { decision: "approve", telescopeId: ID, start: "2027-02-10T01:00:00Z", end: "2027-02-10T02:00:00Z", note: "" };
const visibilityBody = {
  site: { name: "Southern site", latitudeDeg: -30.17, longitudeDeg: -70.8, heightM: 2200, timeZone: "America/Santiago" },
  telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 45, hourAngleHours: { min: -5, max: 5 } },
  target: { kind: "fixed", name: "test field", ra: "05h35m17.3s", dec: "-05 23 28" },
  constraints: { darkness: "nautical", maxAirmass: 2, minMoonSeparationDeg: 30 },
  when: { night: "2025-01-15" },
};

const SCHEMAS: Array<{ name: string; schema: ZodType; valid: Record<string, unknown> }> = [
  { name: "the ToO request", schema: requestSchema, valid: requestBody },
  { name: "a new block", schema: blockInputSchema, valid: blockBody },
  { name: "a block patch", schema: blockPatchSchema, valid: blockBody },
  { name: "the director's decision", schema: decisionSchema, valid: decisionBody },
  { name: "the visibility request", schema: visibilityRequestSchema, valid: visibilityBody },
];

/** Every path into a JSON object (objects and arrays), so a swap can reach nested fields. */
function paths(value: unknown, prefix: Array<string | number> = []): Array<Array<string | number>> {
  if (Array.isArray(value)) return value.flatMap((v, i) => [[...prefix, i], ...paths(v, [...prefix, i])]);
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => [[...prefix, k], ...paths(v, [...prefix, k])]);
  return [];
}

function withSwapped(body: unknown, path: Array<string | number>, replacement: unknown): unknown {
  const copy = structuredClone(body) as Record<string | number, unknown>;
  let at: Record<string | number, unknown> = copy;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string | number, unknown>;
  at[path[path.length - 1]!] = replacement;
  return copy;
}

/** The property: a result, never a throw; a failure is a ZodError with nameable fields. */
function answersCleanly(schema: ZodType, input: unknown): void {
  const result = schema.safeParse(input);
  if (result.success) return;
  expect(result.error).toBeInstanceOf(ZodError);
  expect(result.error.issues.length).toBeGreaterThan(0);
  for (const issue of result.error.issues) expect(typeof issue.message).toBe("string");
  const fields = zodFields(result.error);
  expect(Object.keys(fields).length).toBeGreaterThan(0);
}

/** Values that are JSON, plus a few shapes that tend to trip parsers. */
const nasty = fc.oneof(
  fc.jsonValue(),
  fc.constantFrom("", " ", "NaN", "Infinity", "-0", "1e309", "2027-02-30T25:61:00Z", "0000-00-00", "__proto__", "\u0000", "99:99:99", "-90:00:60"),
  fc.double(),
  fc.string({ unit: "grapheme", maxLength: 40 }),
);

describe.each(SCHEMAS)("$name", ({ schema, valid }) => {
  it("accepts the valid body the properties start from", () => {
    expect(schema.safeParse(valid).success).toBe(true);
  });

  it("answers any JSON value with a result, never a throw", () => {
    fc.assert(fc.property(fc.jsonValue(), (input) => answersCleanly(schema, input)), { numRuns: 300 });
  });

  it("answers a valid body with any one field swapped for anything", () => {
    const all = paths(valid);
    fc.assert(
      fc.property(fc.constantFrom(...all), nasty, (path, replacement) => answersCleanly(schema, withSwapped(valid, path, replacement))),
      { numRuns: 500 },
    );
  });

  it("answers a valid body with unknown extra keys, including __proto__ and constructor", () => {
    fc.assert(
      fc.property(fc.dictionary(fc.constantFrom("__proto__", "constructor", "extra", "toString"), fc.jsonValue()), (extra) =>
        answersCleanly(schema, JSON.parse(JSON.stringify({ ...valid, ...extra })) as unknown),
      ),
      { numRuns: 100 },
    );
  });
});

describe("parseVisibilityRequest (the route's parser)", () => {
  it("never throws and always names at least one field when it refuses", () => {
    fc.assert(
      fc.property(fc.jsonValue(), (input) => {
        const parsed = parseVisibilityRequest(input);
        if (!parsed.ok) expect(Object.keys(parsed.fieldErrors).length).toBeGreaterThan(0);
      }),
      { numRuns: 300 },
    );
  });
});

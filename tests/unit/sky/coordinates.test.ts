import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CoordinateParseError, formatDec, formatRa, parseDec, parseRa } from "@/lib/sky";

const ra = (h: number, m: number, s: number) => (h + m / 60 + s / 3600) * 15;

describe("parseRa", () => {
  it.each([
    ["12:34:56.7", ra(12, 34, 56.7)],
    ["12 34 56.7", ra(12, 34, 56.7)],
    ["  12   34  56.7 ", ra(12, 34, 56.7)],
    ["12h34m56.7s", ra(12, 34, 56.7)],
    ["12h 34m 56.7s", ra(12, 34, 56.7)],
    ["12H34M56.7S", ra(12, 34, 56.7)],
    ["12ʰ34ᵐ56.7ˢ", ra(12, 34, 56.7)],
    ["12h34.5m", ra(12, 34, 30)],
    ["12:34.5", ra(12, 34, 30)],
    ["12.5h", 187.5],
    ["0:00:00", 0],
    ["23:59:59.999", ra(23, 59, 59.999)],
    ["187.5", 187.5],
    ["187.5°", 187.5],
    ["187.5d", 187.5],
    ["187.5 deg", 187.5],
    ["187°30'00\"", 187.5],
    ["187°30′00″", 187.5],
    ["187d30m", 187.5],
    ["+12:00:00", 180],
  ])("reads %j", (text, expected) => {
    expect(parseRa(text)).toBeCloseTo(expected, 10);
  });

  it("reads a bare decimal as hours when asked", () => {
    expect(parseRa("12.5", { bareDecimal: "hours" })).toBeCloseTo(187.5, 12);
  });

  it.each([
    ["", "nothing to read", 1],
    ["   ", "nothing to read", 1],
    ["12:61:00", "minutes must be less than 60", 4],
    ["12:30:60", "seconds must be less than 60", 7],
    ["24:00:00", "hours must be less than 24", 1],
    ["360", "must be less than 360°", 1],
    ["-12:00:00", "cannot be negative", 1],
    ["12,5", "use '.' as the decimal mark", 3],
    ["12:34:56:78", "more than three fields", 10],
    ["12.5:30", "only the last field may have a fractional part", 1],
    ["12h34d", "should be 'm'", 6],
    ["abc", "unexpected character 'a'", 1],
    ["12::30", "no number after it", 3],
    ["12:", "no number after it", 3],
    ["1.2.3", "second decimal point", 4],
    ["12 - 30", "sign is only allowed before the first number", 4],
    ["h12", "unit mark with no number before it", 1],
    ["1e5", "unexpected character 'e'", 2],
  ])("rejects %j: %s at character %i", (text, problem, position) => {
    try {
      parseRa(text);
      expect.unreachable(`"${text}" should not parse`);
    } catch (e) {
      expect(e).toBeInstanceOf(CoordinateParseError);
      const err = e as CoordinateParseError;
      expect(err.message).toContain(problem);
      expect(err.position).toBe(position);
      expect(err.message).toContain(`at character ${position}`);
      expect(err.message).toContain("Right ascension");
    }
  });
});

describe("parseDec", () => {
  it.each([
    ["+12:34:56", 12 + 34 / 60 + 56 / 3600],
    ["12 34 56", 12 + 34 / 60 + 56 / 3600],
    ["-00 30 00", -0.5],
    ["-00:30:00", -0.5],
    ["−00°30′00″", -0.5],
    ["–0 30", -0.5],
    ["- 00 30 00", -0.5],
    ["-0.5", -0.5],
    ["+45.123°", 45.123],
    ["12d34m56s", 12 + 34 / 60 + 56 / 3600],
    ["12°34'56\"", 12 + 34 / 60 + 56 / 3600],
    ["12°34'56''", 12 + 34 / 60 + 56 / 3600],
    ["-89:59:59.9", -(89 + 59 / 60 + 59.9 / 3600)],
    ["90", 90],
    ["-90:00:00", -90],
    ["+00:00:00", 0],
  ])("reads %j", (text, expected) => {
    expect(parseDec(text)).toBeCloseTo(expected, 10);
  });

  it.each([
    ["+91", "must be between −90° and +90°", 2],
    ["90:00:01", "must be between −90° and +90°", 1],
    ["12h30m", "hours are not a unit of declination", 3],
    ["--10", "sign is only allowed before the first number", 2],
    ["10 20 30 40", "more than three fields", 10],
  ])("rejects %j: %s at character %i", (text, problem, position) => {
    expect(() => parseDec(text)).toThrow(CoordinateParseError);
    try {
      parseDec(text);
    } catch (e) {
      const err = e as CoordinateParseError;
      expect(err.message).toContain(problem);
      expect(err.position).toBe(position);
      expect(err.message).toContain("Declination");
    }
  });
});

describe("formatRa / formatDec", () => {
  it("write the three styles", () => {
    expect(formatRa(ra(5, 35, 17.3))).toBe("05:35:17.30");
    expect(formatRa(ra(5, 35, 17.3), { style: "spaces", decimals: 1 })).toBe("05 35 17.3");
    expect(formatRa(ra(5, 35, 17.3), { style: "units", decimals: 0 })).toBe("05h35m17s");
    expect(formatDec(-5.391111)).toBe("-05:23:28.0");
    expect(formatDec(-0.5, { style: "spaces", decimals: 0 })).toBe("-00 30 00");
    expect(formatDec(41.269, { style: "units" })).toBe("+41°16′08.4″");
  });
  it("carry rounding into minutes, hours and the 24 h wrap", () => {
    expect(formatRa(ra(1, 59, 59.999))).toBe("02:00:00.00");
    expect(formatRa(359.99999999)).toBe("00:00:00.00");
    expect(formatDec(-0.0000001)).toBe("+00:00:00.0");
  });
});

// Tolerance of a round trip: half a unit of the last written digit.
const raTolDeg = (decimals: number) => (0.5 * 10 ** -decimals * 15) / 3600 + 1e-9;
const decTolDeg = (decimals: number) => (0.5 * 10 ** -decimals) / 3600 + 1e-9;
const styles = fc.constantFrom("colons" as const, "spaces" as const, "units" as const);

describe("property: format → parse round trips", () => {
  it("right ascension, any value, style and precision", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 360, maxExcluded: true, noNaN: true }),
        styles,
        fc.integer({ min: 0, max: 5 }),
        (x, style, decimals) => {
          const back = parseRa(formatRa(x, { style, decimals }));
          const diff = Math.abs(back - x);
          expect(Math.min(diff, 360 - diff)).toBeLessThanOrEqual(raTolDeg(decimals));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("declination, any value, style and precision, sign kept", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }),
        styles,
        fc.integer({ min: 0, max: 4 }),
        (x, style, decimals) => {
          const text = formatDec(x, { style, decimals });
          const back = parseDec(text);
          expect(Math.abs(back - x)).toBeLessThanOrEqual(decTolDeg(decimals));
          if (x < -decTolDeg(decimals)) expect(text.startsWith("-")).toBe(true);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it("small negative declinations like -00 30 00 stay negative", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 59 }), fc.integer({ min: 0, max: 59 }), (m, s) => {
        expect(parseDec(`-00 ${m} ${s}`)).toBeCloseTo(-(m / 60 + s / 3600), 12);
      }),
    );
  });
});

function expectParsedOrExplained(read: (s: string) => number, input: string, lo: number, hi: number): void {
  let value: number;
  try {
    value = read(input);
  } catch (e) {
    expect(e).toBeInstanceOf(Error);
    expect(e).toBeInstanceOf(CoordinateParseError);
    const err = e as CoordinateParseError;
    expect(err.message).toMatch(/: .+ \(at character \d+\)\.$/);
    expect(err.position).toBeGreaterThanOrEqual(1);
    expect(err.position).toBeLessThanOrEqual(input.length + 1);
    return;
  }
  expect(Number.isFinite(value)).toBe(true);
  expect(value).toBeGreaterThanOrEqual(lo);
  expect(value).toBeLessThanOrEqual(hi);
}

// Text made of the characters coordinates are typed with, so the fuzzing reaches deep.
const coordinateText = fc
  .array(fc.constantFrom(..."0123456789.:+-−– hmsdHMSD°′″'\",e".split("")), { maxLength: 24 })
  .map((chars) => chars.join(""));

describe("property: no input crashes the parser", () => {
  it("any Unicode text either parses into range or throws a located CoordinateParseError", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ unit: "binary" }), fc.string({ unit: "grapheme" }), coordinateText), (s) => {
        expectParsedOrExplained((x) => parseRa(x), s, 0, 360);
        expectParsedOrExplained(parseDec, s, -90, 90);
      }),
      { numRuns: 5000 },
    );
  });
});

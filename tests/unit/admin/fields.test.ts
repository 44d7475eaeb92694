import { describe, expect, it } from "vitest";
import { codeField, numberField, parseUtInstant, toUtInputValue, utInstantField } from "@/lib/validation/fields";

const firstMessage = (result: { success: boolean; error?: { issues: Array<{ message: string }> } }) => result.error?.issues[0]?.message;

describe("numberField", () => {
  const field = numberField({ required: "Enter it.", min: 0, max: 10, range: "0 to 10." });

  it("reads numbers typed into a form, with spaces around them", () => {
    expect(field.parse(" 2.5 ")).toBe(2.5);
    expect(field.parse(7)).toBe(7);
  });

  it("tells an empty box from text that is not a number", () => {
    expect(firstMessage(field.safeParse(""))).toBe("Enter it.");
    expect(firstMessage(field.safeParse("   "))).toBe("Enter it.");
    expect(firstMessage(field.safeParse(undefined))).toBe("Enter it.");
    expect(firstMessage(field.safeParse("2,5"))).toBe("Enter a number, using a dot for decimals.");
  });

  it("refuses values out of range, and fractions where whole numbers are wanted", () => {
    expect(firstMessage(field.safeParse("10.01"))).toBe("0 to 10.");
    expect(firstMessage(field.safeParse(-1))).toBe("0 to 10.");
    const whole = numberField({ required: "x", min: 0, max: 10, integer: true, range: "Whole, 0 to 10." });
    expect(firstMessage(whole.safeParse("1.5"))).toBe("Whole, 0 to 10.");
    expect(whole.parse("4")).toBe(4);
  });

  it("can exclude its lower bound", () => {
    const open = numberField({ required: "x", min: 0, max: 1, minExclusive: true, range: "above 0" });
    expect(open.safeParse("0").success).toBe(false);
    expect(open.parse("0.001")).toBe(0.001);
  });
});

describe("codeField", () => {
  it("trims and refuses spaces or an empty code", () => {
    expect(codeField("site").parse("  AQS ")).toBe("AQS");
    expect(firstMessage(codeField("site").safeParse("A Q"))).toMatch(/without spaces/);
    expect(firstMessage(codeField("site").safeParse(""))).toBe("Enter the site's code.");
  });
});

describe("UT instants", () => {
  it("reads a datetime-local value as UT, not as the machine's local time", () => {
    expect(parseUtInstant("2027-02-01T00:00")?.toISOString()).toBe("2027-02-01T00:00:00.000Z");
    expect(parseUtInstant("2027-02-01 18:30:15")?.toISOString()).toBe("2027-02-01T18:30:15.000Z");
  });

  it("accepts a full ISO 8601 instant with its offset", () => {
    expect(parseUtInstant("2027-02-01T00:00:00-03:00")?.toISOString()).toBe("2027-02-01T03:00:00.000Z");
  });

  it("refuses impossible dates instead of rolling them over", () => {
    expect(parseUtInstant("2027-02-30T00:00")).toBeUndefined();
    expect(parseUtInstant("2027-13-01T00:00")).toBeUndefined();
    expect(parseUtInstant("2027-01-01T24:00")).toBeUndefined();
    expect(parseUtInstant("next tuesday")).toBeUndefined();
  });

  it("gives field messages for empty and unreadable times, and round-trips the input value", () => {
    const field = utInstantField("Enter the start.");
    expect(firstMessage(field.safeParse(""))).toBe("Enter the start.");
    expect(firstMessage(field.safeParse("2027-02-30T00:00"))).toMatch(/date and time in UT/);
    const date = new Date("2027-08-01T12:34:00Z");
    expect(field.parse(toUtInputValue(date))).toEqual(date);
    expect(field.parse(date)).toEqual(date);
  });
});

import { describe, expect, it } from "vitest";
import { paybackNightRefusal } from "@/lib/ledger/night-window";

const at = (iso: string) => new Date(iso);
// The demo's Chilean site, and one far enough north for midnight sun and polar night.
const quebrada = { name: "Alto Quebrada Station", latitudeDeg: -30.52, longitudeDeg: -70.41, heightM: 2310, timeZone: "America/Santiago" };
const svalbard = { name: "Adventdalen", latitudeDeg: 78.22, longitudeDeg: 15.65, heightM: 0, timeZone: "Arctic/Longyearbyen" };

describe("when a payback block may run", () => {
  it("refuses midday, naming the night's sunset and sunrise in UT and local time, beside both fields", () => {
    // 2026-12-03 15:00–16:00 UT is 12:00–13:00 at the site: before local mean noon, so the night of the 2nd.
    expect(paybackNightRefusal(quebrada, at("2026-12-03T15:00:00Z"), at("2026-12-03T16:00:00Z"))).toEqual({
      message:
        "That time is in daylight at Alto Quebrada Station. On the night of 2026-12-02 the Sun is down from sunset at 2026-12-02 23:31 UT (20:31 GMT-3) to sunrise at 2026-12-03 09:31 UT (06:31 GMT-3): a payback block must lie wholly within that time. Nothing was saved.",
      fields: ["startsAt", "endsAt"],
    });
  });

  it("takes a block between sunset and sunrise, and puts an edge outside them beside its own field", () => {
    expect(paybackNightRefusal(quebrada, at("2026-12-04T02:00:00Z"), at("2026-12-04T04:00:00Z"))).toBeNull();
    expect(paybackNightRefusal(quebrada, at("2026-12-04T08:00:00Z"), at("2026-12-04T10:00:00Z"))).toMatchObject({ message: expect.stringMatching(/^That block runs past sunrise at Alto Quebrada Station\. /), fields: ["endsAt"] });
    expect(paybackNightRefusal(quebrada, at("2026-12-03T22:00:00Z"), at("2026-12-04T01:00:00Z"))).toMatchObject({ message: expect.stringMatching(/^That block starts before sunset at /), fields: ["startsAt"] });
    expect(paybackNightRefusal(quebrada, at("2026-12-03T22:00:00Z"), at("2026-12-04T10:00:00Z"))).toMatchObject({ message: expect.stringMatching(/^That block starts before sunset and runs past sunrise at /), fields: ["startsAt", "endsAt"] });
    // A block from one night's dark into the next crosses a day.
    expect(paybackNightRefusal(quebrada, at("2026-12-04T02:00:00Z"), at("2026-12-05T02:00:00Z"))).toMatchObject({ fields: ["endsAt"] });
  });

  it("says so when the Sun does not set that night", () => {
    expect(paybackNightRefusal(svalbard, at("2027-06-20T22:00:00Z"), at("2027-06-20T23:00:00Z"))).toEqual({
      message: "The Sun does not set at Adventdalen on the night of 2027-06-20: there is no dark time for a payback block that night. Choose a night when the Sun sets. Nothing was saved.",
      fields: ["startsAt", "endsAt"],
    });
  });

  it("in polar night takes any block within one night, and refuses one running past its local noon", () => {
    expect(paybackNightRefusal(svalbard, at("2027-12-19T20:00:00Z"), at("2027-12-20T04:00:00Z"))).toBeNull();
    const refusal = paybackNightRefusal(svalbard, at("2027-12-20T09:00:00Z"), at("2027-12-20T12:00:00Z"));
    expect(refusal?.fields).toEqual(["endsAt"]);
    expect(refusal?.message).toMatch(
      /^That block runs past local noon, the end of that night, at Adventdalen\. On the night of 2027-12-19 the Sun is down from local noon at 2027-12-19 10:5\d UT \(11:5\d CET\), as it did not rise that day, to local noon at 2027-12-20 10:5\d UT \(11:5\d CET\), as it does not rise before then: /,
    );
  });

  it("where the Sun sets but does not rise again before local noon, the dark time runs from sunset to the end of the night", () => {
    // The night of 2027-10-26 at 78° N: the last sunset before the polar night, just after noon.
    expect(paybackNightRefusal(svalbard, at("2027-10-27T08:00:00Z"), at("2027-10-27T09:00:00Z"))).toBeNull();
    expect(paybackNightRefusal(svalbard, at("2027-10-26T11:00:00Z"), at("2027-10-26T12:00:00Z"))).toMatchObject({
      message: expect.stringMatching(/^That block starts before sunset at Adventdalen\. On the night of 2027-10-26 the Sun is down from sunset at 2027-10-26 11:21 UT \(13:21 CEST\) to local noon at 2027-10-27 10:57 UT \(12:57 CEST\), as it does not rise before then: /),
      fields: ["startsAt"],
    });
  });
});

// The pure pieces: in-app text, links, idempotency keys, delivery policy, outbox URL check.
import { describe, expect, it } from "vitest";
import { DEFAULT_POLICY, policyFromEnv } from "@/lib/notices/config";
import { describeNotice } from "@/lib/notices/describe";
import { noticeKey } from "@/lib/notices/enqueue";
import { appBaseUrl, noticeLink } from "@/lib/notices/links";
import { localFakeUrl } from "@/lib/notices/outbox";
import { blockDisplaced, decisionMade, outcomeLogged, paybackScheduled, requestLapsed, requestReturned, requestSubmitted, TARGET, tonightChanged } from "../../support/notice-payloads";

describe("in-app notice text", () => {
  it("names the facts in UT and local time and links to the page that answers it", () => {
    const p = requestSubmitted();
    expect(describeNotice({ event: "request_submitted", payload: p })).toEqual({
      title: `ToO request for ${TARGET} (CON-TOO-02), urgency tonight`,
      body: "Ilona Marsh asks for 1 h 30 min on AQ41, AQ16, submitted 2026-12-01 21:47 UT (2026-12-01 18:47 GMT-3).",
      link: `/review/${p.requestId}`,
    });
    const d = describeNotice({ event: "block_displaced", payload: blockDisplaced() });
    expect(d.body).toContain("1 h 30 min go to a ToO override");
    expect(d.body).toContain("AUR-114 is owed 1.5 h");
    expect(d.link).toBe("/ledger");
  });

  it("links every event to its page", () => {
    const decision = decisionMade();
    expect(noticeLink({ event: "decision_made", payload: decision })).toBe(`/requests/${decision.requestId}`);
    expect(noticeLink({ event: "tonight_changed", payload: tonightChanged() })).toBe("/tonight/AQ41");
    expect(noticeLink({ event: "payback_scheduled", payload: paybackScheduled() })).toBe("/ledger");
    const outcome = outcomeLogged();
    expect(noticeLink({ event: "outcome_logged", payload: outcome })).toBe(`/requests/${outcome.requestId}`);
    const lapsed = requestLapsed();
    expect(noticeLink({ event: "request_lapsed", payload: lapsed })).toBe(`/requests/${lapsed.requestId}`);
    const returned = requestReturned();
    expect(noticeLink({ event: "request_returned", payload: returned })).toBe(`/requests/${returned.requestId}`);
  });

  it("tells the PI their request came back as a draft, with the director's note and the deadline in UT and local time", () => {
    const p = requestReturned();
    expect(describeNotice({ event: "request_returned", payload: p })).toEqual({
      title: `Your ToO request for ${TARGET} was returned for changes`,
      body:
        "It is a draft again and out of the review queue until you file it again. " +
        "Your deadline 2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3) still stands. " +
        `Tomasz Okafor-Lind: ${p.note}`,
      link: `/requests/${p.requestId}`,
    });
    expect(describeNotice({ event: "request_returned", payload: requestReturned({ deadline: null }) }).body).not.toContain("deadline");
  });

  it("tells the PI that the deadline passed before a decision, in UT and local time, and what they can do", () => {
    const p = requestLapsed();
    expect(describeNotice({ event: "request_lapsed", payload: p })).toEqual({
      title: `Your ToO request for ${TARGET} lapsed at its deadline`,
      body:
        "The deadline 2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3) passed while the request was in review, before a director decided it. " +
        `It will not be scheduled. If ${TARGET} is still worth observing, file a new request with a later deadline.`,
      link: `/requests/${p.requestId}`,
    });
    expect(describeNotice({ event: "request_lapsed", payload: requestLapsed({ fromState: "submitted" }) }).body).toContain("while the request was waiting in the review queue,");
  });

  it("tells the PI in a plain sentence what the night log says happened to their ToO", () => {
    const p = outcomeLogged();
    expect(describeNotice({ event: "outcome_logged", payload: p })).toEqual({
      title: `Your ToO override for ${TARGET} on AQ41: lost to weather`,
      body:
        `Your override for ${TARGET} on AQ41 was lost to weather; nothing was observed. ` +
        "Block 2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3). " +
        "Paz Irarrázabal: Dome closed at 01:55 UT: humidity above 90 % and fog from the valley.",
      link: `/requests/${p.requestId}`,
    });
  });

  it("keeps a title within 300 characters however long the target name", () => {
    const { title } = describeNotice({ event: "request_submitted", payload: requestSubmitted({ targetName: "x".repeat(200), programTitle: "y" }) });
    expect(title.length).toBeLessThanOrEqual(300);
  });
});

describe("keys, links and settings", () => {
  it("builds a deterministic idempotency key per event, subject and recipient", () => {
    expect(noticeKey("block_displaced", "d1", "u1")).toBe("block_displaced:d1:u1");
  });

  it("takes the app's address from APP_URL, then NEXTAUTH_URL", () => {
    expect(appBaseUrl({ APP_URL: "http://127.0.0.1:3100/" })).toBe("http://127.0.0.1:3100");
    expect(appBaseUrl({ NEXTAUTH_URL: "https://desk.example.test" })).toBe("https://desk.example.test");
    expect(appBaseUrl({})).toBe("http://localhost:3000");
  });

  it("reads the delivery policy from the environment", () => {
    expect(policyFromEnv({})).toEqual(DEFAULT_POLICY);
    expect(policyFromEnv({ NOTICE_RETRY_BACKOFF: "off", NOTICE_RETRY_DELAY_SECONDS: "0", NOTICE_POLL_SECONDS: "0.5" })).toMatchObject({
      retryBackoff: false,
      retryDelaySeconds: 0,
      pollingIntervalSeconds: 0.5,
    });
    expect(() => policyFromEnv({ NOTICE_POLL_SECONDS: "0.1" })).toThrow(/NOTICE_POLL_SECONDS/);
  });

  it("shows the outbox only for a mail service on this machine", () => {
    expect(localFakeUrl({ RESEND_BASE_URL: "http://127.0.0.1:4010" })).toBe("http://127.0.0.1:4010");
    expect(localFakeUrl({ RESEND_BASE_URL: "http://localhost:4010/" })).toBe("http://localhost:4010");
    expect(localFakeUrl({ RESEND_BASE_URL: "https://api.resend.com" })).toBeNull();
    expect(localFakeUrl({ RESEND_BASE_URL: "http://127.0.0.1.example.test" })).toBeNull();
    expect(localFakeUrl({})).toBeNull();
  });
});

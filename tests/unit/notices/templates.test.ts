// Each notice e-mail, rendered from a realistic case: the facts, the times (UT with the
// site's local time; Chile keeps UTC−3 in December) and the links must all be there, in
// the HTML and in the plain-text version.
import { describe, expect, it } from "vitest";
import { parseNotice, type NoticeOf } from "@/lib/notices/events";
import { renderNoticeEmail, replyToFor, type RenderedEmail } from "@/lib/notices/render";
import { blockDisplaced, decisionMade, outcomeLogged, paybackScheduled, requestLapsed, requestReturned, requestSubmitted, TARGET, tonightChanged } from "../../support/notice-payloads";

const APP = "https://desk.nightbreak.test";

async function renderAs(notice: NoticeOf): Promise<RenderedEmail> {
  // Through JSON and back, as a queued job travels.
  const travelled = parseNotice(notice.event, JSON.parse(JSON.stringify(notice.payload)));
  return renderNoticeEmail(travelled, { recipientName: "Rafa Quennell", appUrl: APP });
}

function expectInText(email: RenderedEmail, ...facts: string[]) {
  for (const fact of facts) expect(email.text).toContain(fact);
}

function expectInHtml(email: RenderedEmail, ...facts: string[]) {
  for (const fact of facts) expect(email.html).toContain(fact);
}

function expectCommonParts(email: RenderedEmail) {
  expect(email.html).toMatch(/^<!DOCTYPE html/);
  expect(email.text).not.toMatch(/<[a-z]+[\s>]/i);
  expect(email.text).toContain("Hello Rafa Quennell,");
  expect(email.html).toContain(`href="${APP}/notices#preferences"`);
  expect(email.text).toContain("Times are in UT, with the site's local time in brackets.");
}

describe("notice e-mails", () => {
  it("request submitted: target, PI, urgency, requested time, telescopes, window, and a link to the review", async () => {
    const p = requestSubmitted();
    const email = await renderAs({ event: "request_submitted", payload: p });
    expectCommonParts(email);
    expect(email.subject).toBe(`ToO request for ${TARGET} (CON-TOO-02), urgency tonight`);
    expectInText(
      email,
      TARGET,
      "CON-TOO-02 — Rapid characterisation of fast-moving small bodies",
      "Ilona Marsh",
      "Urgency  tonight",
      "Requested time  1 h 30 min",
      "AQ41 (Quebrada 4.1 m), AQ16 (Quebrada 1.6 m)",
      "Submitted  2026-12-01 21:47 UT (2026-12-01 18:47 GMT-3)",
      "2026-12-02 02:10–05:20 UT (2026-12-01 23:10–2026-12-02 02:20 GMT-3) at Alto Quebrada Station",
      "fading by about 0.4 mag per day",
      `${APP}/review/${p.requestId}`,
    );
    expect(email.text).not.toContain("Deadline");
    expectInHtml(email, "2026-12-01 21:47 UT (2026-12-01 18:47 GMT-3)", "Ilona Marsh", "1 h 30 min");
    expect(email.html).toContain(`href="${APP}/review/${p.requestId}"`);

    const later = await renderAs({
      event: "request_submitted",
      payload: requestSubmitted({ urgency: "within_days", deadline: new Date("2026-12-05T12:00:00Z"), firstWindow: null }),
    });
    expectInText(later, "Urgency  within days", "Deadline  2026-12-05 12:00 UT (2026-12-05 09:00 GMT-3)", "none found by the feasibility check");
  });

  it("decision made: approved with reason and slot; declined with reason and no slot", async () => {
    const p = decisionMade();
    const approved = await renderAs({ event: "decision_made", payload: p });
    expectCommonParts(approved);
    expect(approved.subject).toBe(`Your ToO request for ${TARGET} was approved`);
    expectInText(
      approved,
      "Fading fast and well placed after midnight; the displaced engineering time is easy to repay.",
      "Decided by  Tomasz Okafor-Lind <director@nightbreak.test>",
      "Decided  2026-12-01 22:31 UT (2026-12-01 19:31 GMT-3)",
      "Telescope  AQ41 (Quebrada 4.1 m), Alto Quebrada Station",
      "Slot  2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)",
      "Displaced  1 h 30 min of scheduled time",
      `${APP}/requests/${p.requestId}`,
    );

    expectInHtml(approved, "2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)", `href="${APP}/requests/${p.requestId}"`);

    const declined = await renderAs({
      event: "decision_made",
      payload: decisionMade({ decision: "declined", slot: null, displacedMinutes: 0, reason: "Below the horizon from both sites until it has faded past our limits." }),
    });
    expect(declined.subject).toContain("was declined");
    expectInText(declined, "Decision  declined", "Below the horizon from both sites until it has faded past our limits.");
    expect(declined.text).not.toContain("Slot");
  });

  it("block displaced: what is lost, by how much, what remains, what is owed, who to contact", async () => {
    const p = blockDisplaced();
    const email = await renderAs({ event: "block_displaced", payload: p });
    expectCommonParts(email);
    expect(email.subject).toBe("Your AUR-114 block on AQ41 was shortened by 1 h 30 min");
    expectInText(
      email,
      "Your block  2026-12-02 01:00–05:00 UT (2026-12-01 22:00–2026-12-02 02:00 GMT-3)",
      "Given to the override  2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)",
      "Time lost  1 h 30 min",
      "What remains  2026-12-02 01:00–02:10 UT (2026-12-01 22:00–23:10 GMT-3)",
      "2026-12-02 03:40–05:00 UT (2026-12-02 00:40–02:00 GMT-3)",
      "Owed to the program  1.5 h on the time-owed ledger",
      "Contact  Tomasz Okafor-Lind <director@nightbreak.test>",
      `override for ${TARGET}`,
      `${APP}/ledger`,
    );

    expectInHtml(email, "2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)", "1.5 h on the time-owed ledger", `href="${APP}/ledger"`);

    const whole = await renderAs({ event: "block_displaced", payload: blockDisplaced({ lost: [p.block], lostMinutes: 240, remaining: [], owedHours: 4 }) });
    expect(whole.subject).toBe("Your AUR-114 block on AQ41 was given to an override");
    expectInText(whole, "Time lost  4 h 00 min", "nothing: the whole block went to the override", "4.0 h on the time-owed ledger");
  });

  it("tonight changed: every change in time order, the safety note, and a link to tonight's queue", async () => {
    const p = tonightChanged();
    const email = await renderAs({ event: "tonight_changed", payload: { ...p, changes: [...p.changes].reverse() } });
    expectCommonParts(email);
    expect(email.subject).toBe("Tonight's queue on AQ41 changed (night of 2026-12-01)");
    const lines = ["Shortened", "Added", "Split"].map((kind) => email.text.indexOf(kind));
    expect(lines.every((i) => i > 0)).toBe(true);
    expect([...lines].sort((a, b) => a - b)).toEqual(lines);
    expectInText(
      email,
      "AUR-114 · R. Quennell  2026-12-02 01:00–02:10 UT (2026-12-01 22:00–23:10 GMT-3)",
      `CON-TOO-02 · ${TARGET}  2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)`,
      "the decision to open, point or close the telescope stays with you",
      `${APP}/tonight/AQ41`,
    );
    expectInHtml(email, "2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)", `href="${APP}/tonight/AQ41"`);
  });

  it("payback scheduled: when, how long, the balance before and after", async () => {
    const email = await renderAs({ event: "payback_scheduled", payload: paybackScheduled() });
    expectCommonParts(email);
    expect(email.subject).toBe("Payback block for AUR-114: 1 h 30 min on AQ41");
    expectInText(
      email,
      "When  2027-01-14 03:00–04:30 UT (2027-01-14 00:00–01:30 GMT-3)",
      "Length  1 h 30 min",
      "Owed before  1.5 h",
      "Still owed after  0.0 h",
      `${APP}/ledger`,
    );
    expectInHtml(email, "2027-01-14 03:00–04:30 UT (2027-01-14 00:00–01:30 GMT-3)", `href="${APP}/ledger"`);
  });

  it("outcome logged: lost to weather, in a plain sentence, with the block in UT and local time, the note and a link to the request", async () => {
    const p = outcomeLogged();
    const email = await renderAs({ event: "outcome_logged", payload: p });
    expectCommonParts(email);
    expect(email.subject).toBe(`Your ToO override for ${TARGET} on AQ41: lost to weather`);
    expectInText(
      email,
      `Your override for ${TARGET} on AQ41 was lost to weather; nothing was observed.`,
      "Dome closed at 01:55 UT: humidity above 90 % and fog from the valley.",
      "Program  CON-TOO-02",
      "Telescope  AQ41 (Quebrada 4.1 m), Alto Quebrada Station",
      "Block  2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)",
      "Outcome  lost to weather",
      "Request is now  not executed",
      "Logged by  Paz Irarrázabal <na.aq41@nightbreak.test>",
      "Logged  2026-12-02 04:05 UT (2026-12-02 01:05 GMT-3)",
      `${APP}/requests/${p.requestId}`,
    );
    expect(email.text).not.toContain("Time observed");
    expectInHtml(email, "2026-12-02 02:10–03:40 UT (2026-12-01 23:10–2026-12-02 00:40 GMT-3)", `href="${APP}/requests/${p.requestId}"`);

    const fault = await renderAs({ event: "outcome_logged", payload: outcomeLogged({ outcome: "technical", note: "" }) });
    expectInText(fault, `Your override for ${TARGET} on AQ41 was lost to a technical fault; nothing was observed.`, "The night assistant left no note.");

    const partial = await renderAs({ event: "outcome_logged", payload: outcomeLogged({ outcome: "partial", minutesUsed: 40, requestState: "partially_executed", note: "Clouds from 02:50 UT." }) });
    expect(partial.subject).toBe(`Your ToO override for ${TARGET} on AQ41: partially executed`);
    expectInText(partial, `Your override for ${TARGET} on AQ41 was partly observed: 40 min of the 1 h 30 min block.`, "Time observed  40 min", "Request is now  partially executed");

    const done = await renderAs({ event: "outcome_logged", payload: outcomeLogged({ outcome: "executed", minutesUsed: 85, requestState: "executed", note: "Seeing 0.8″." }) });
    expectInText(done, `Your override for ${TARGET} on AQ41 was observed: 1 h 25 min on sky.`, "Request is now  executed");
  });

  it("request lapsed: the deadline passed before a decision, in UT and local time, what it means and a link to the request", async () => {
    const p = requestLapsed();
    const email = await renderAs({ event: "request_lapsed", payload: p });
    expectCommonParts(email);
    expect(email.subject).toBe(`Your ToO request for ${TARGET} lapsed at its deadline`);
    expectInText(
      email,
      "The deadline 2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3) passed while the request was in review, before a director decided it.",
      "will not be scheduled and no time is charged to CON-TOO-02",
      "file a new request with a later deadline",
      "Program  CON-TOO-02",
      "Urgency  within days",
      "Requested time  1 h 30 min",
      "Telescopes  AQ41 (Quebrada 4.1 m), AQ16 (Quebrada 1.6 m)",
      "Submitted  2026-12-01 21:47 UT (2026-12-01 18:47 GMT-3)",
      "Deadline  2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3)",
      "Was  in review",
      "Lapsed  2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3)",
      `${APP}/requests/${p.requestId}`,
    );
    expectInHtml(email, "2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3)", `href="${APP}/requests/${p.requestId}"`);

    const unopened = await renderAs({ event: "request_lapsed", payload: requestLapsed({ fromState: "submitted", telescopes: [] }) });
    expectInText(unopened, "while the request was waiting in the review queue", "Was  waiting in the review queue");
    expect(unopened.text).not.toContain("Telescopes");
  });

  it("request returned: the director's note quoted, who returned it and when, the deadline, and a link to edit the request", async () => {
    const p = requestReturned();
    const email = await renderAs({ event: "request_returned", payload: p });
    expectCommonParts(email);
    expect(email.subject).toBe(`Your ToO request for ${TARGET} was returned for changes`);
    expectInText(
      email,
      "The director sent your request back to you as a draft. What they ask you to change:",
      "Ask for AQ16 as well: AQ41 is in engineering until 03:00 UT.",
      "And attach the finding chart you mention.",
      "until then it is not in the review queue and cannot be scheduled. Your deadline still stands.",
      "Program  CON-TOO-02",
      "Returned by  Tomasz Okafor-Lind <director@nightbreak.test>",
      "Returned  2026-12-01 22:31 UT (2026-12-01 19:31 GMT-3)",
      "Deadline  2026-12-03 12:00 UT (2026-12-03 09:00 GMT-3)",
      "Edit the request",
      `${APP}/requests/${p.requestId}`,
    );
    expectInHtml(email, "Ask for AQ16 as well: AQ41 is in engineering until 03:00 UT.", "2026-12-01 22:31 UT (2026-12-01 19:31 GMT-3)", `href="${APP}/requests/${p.requestId}"`);
    expect(replyToFor({ event: "request_returned", payload: p })).toBe("director@nightbreak.test");

    const noDeadline = await renderAs({ event: "request_returned", payload: requestReturned({ deadline: null }) });
    expect(noDeadline.text).not.toContain("Deadline");
    expect(noDeadline.text).not.toContain("Your deadline still stands");
  });

  it("renders the same bytes twice, so a retried send matches its idempotency key", async () => {
    const notice: NoticeOf = { event: "block_displaced", payload: blockDisplaced() };
    expect(await renderAs(notice)).toEqual(await renderAs(notice));
  });
});

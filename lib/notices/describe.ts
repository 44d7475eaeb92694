/**
 * The in-app notice (and the e-mail subject) for each event: one title line and a short
 * plain-text body. Pure, so the enqueue path can write it inside the caller's transaction.
 */
import type { NoticeOf } from "./events";
import { formatDuration, formatHours, lapseSentence, OUTCOME_WORDS, outcomeSentence, rangeUtAndLocal, URGENCY_LABELS, utAndLocal } from "./format";
import { noticeLink } from "./links";

export interface NoticeText {
  title: string;
  body: string;
  link: string;
}

export function describeNotice(notice: NoticeOf): NoticeText {
  const { title, body } = describe(notice);
  // The column allows 300 characters; long target names must not make the insert fail.
  return { title: title.length > 300 ? `${title.slice(0, 299)}…` : title, body, link: noticeLink(notice) };
}

function describe(notice: NoticeOf): Omit<NoticeText, "link"> {
  switch (notice.event) {
    case "request_submitted": {
      const p = notice.payload;
      const tz = p.site.timeZone;
      const deadline = p.deadline ? ` Deadline ${utAndLocal(p.deadline, tz)}.` : "";
      return {
        title: `ToO request for ${p.targetName} (${p.programCode}), urgency ${URGENCY_LABELS[p.urgency]}`,
        body:
          `${p.piName} asks for ${formatDuration(p.requestedMinutes)} on ${p.telescopes.map((t) => t.code).join(", ")}, ` +
          `submitted ${utAndLocal(p.submittedAt, tz)}.${deadline}`,
      };
    }
    case "decision_made": {
      const p = notice.payload;
      const slot = p.slot ? ` Slot: ${p.slot.telescope.code}, ${rangeUtAndLocal(p.slot.startsAt, p.slot.endsAt, p.site.timeZone)}.` : "";
      return {
        title: `Your ToO request for ${p.targetName} was ${p.decision}`,
        body: `${p.decidedBy.name}: ${p.reason}${slot}`,
      };
    }
    case "block_displaced": {
      const p = notice.payload;
      const whole = p.remaining.length === 0;
      return {
        title: whole
          ? `Your ${p.programCode} block on ${p.telescope.code} was given to an override`
          : `Your ${p.programCode} block on ${p.telescope.code} was shortened by ${formatDuration(p.lostMinutes)}`,
        body:
          `Block ${rangeUtAndLocal(p.block.startsAt, p.block.endsAt, p.site.timeZone)}: ${formatDuration(p.lostMinutes)} go to a ToO override for ${p.targetName}. ` +
          `${p.programCode} is owed ${formatHours(p.owedHours)}. Questions: ${p.contact.name}.`,
      };
    }
    case "tonight_changed": {
      const p = notice.payload;
      const n = p.changes.length;
      return {
        title: `Tonight's queue on ${p.telescope.code} changed (night of ${p.nightOf})`,
        body:
          `${n} change${n === 1 ? "" : "s"}${p.targetName ? ` for a ToO override on ${p.targetName}` : ""}: ` +
          p.changes.map((c) => `${c.kind} ${c.programCode} ${rangeUtAndLocal(c.startsAt, c.endsAt, p.site.timeZone)}`).join("; ") +
          ".",
      };
    }
    case "payback_scheduled": {
      const p = notice.payload;
      return {
        title: `Payback block for ${p.programCode}: ${formatDuration(p.minutes)} on ${p.telescope.code}`,
        body:
          `${rangeUtAndLocal(p.startsAt, p.endsAt, p.site.timeZone)}. ` +
          `Owed before: ${formatHours(p.owedBeforeHours)}; still owed after it: ${formatHours(p.owedAfterHours)}.`,
      };
    }
    case "outcome_logged": {
      const p = notice.payload;
      const note = p.note.trim() ? ` ${p.loggedBy.name}: ${p.note.trim()}` : ` Logged by ${p.loggedBy.name}.`;
      return {
        title: `Your ToO override for ${p.targetName} on ${p.telescope.code}: ${OUTCOME_WORDS[p.outcome]}`,
        body: `${outcomeSentence(p)} Block ${rangeUtAndLocal(p.block.startsAt, p.block.endsAt, p.site.timeZone)}.${note}`,
      };
    }
    case "request_lapsed": {
      const p = notice.payload;
      return {
        title: `Your ToO request for ${p.targetName} lapsed at its deadline`,
        body: `${lapseSentence(p)} It will not be scheduled. If ${p.targetName} is still worth observing, file a new request with a later deadline.`,
      };
    }
    case "request_returned": {
      const p = notice.payload;
      const deadline = p.deadline ? ` Your deadline ${utAndLocal(p.deadline, p.site.timeZone)} still stands.` : "";
      return {
        title: `Your ToO request for ${p.targetName} was returned for changes`,
        body: `It is a draft again and out of the review queue until you file it again.${deadline} ${p.returnedBy.name}: ${p.note}`,
      };
    }
  }
}

/** Words for request states, urgency tiers and attachment kinds, as people read them. */
import type { AttachmentKind, DarknessLevel, RequestState, RequestUrgency } from "@/db/types";

export const STATE_LABELS: Record<RequestState, string> = {
  draft: "Draft",
  submitted: "Submitted",
  in_review: "In review",
  approved: "Approved",
  declined: "Declined",
  withdrawn: "Withdrawn",
  lapsed: "Lapsed",
  executed: "Executed",
  partially_executed: "Partially executed",
  not_executed: "Not executed",
};

export const URGENCY_LABELS: Record<RequestUrgency, string> = {
  now: "Now — interrupt the current block",
  tonight: "Tonight",
  within_days: "Within days (by the deadline)",
};

export const URGENCY_SHORT: Record<RequestUrgency, string> = { now: "Now", tonight: "Tonight", within_days: "Within days" };

export const DARKNESS_LABELS: Record<DarknessLevel, string> = {
  civil: "Civil (Sun below −6°)",
  nautical: "Nautical (Sun below −12°)",
  astronomical: "Astronomical (Sun below −18°)",
};

export const ATTACHMENT_KIND_LABELS: Record<AttachmentKind, string> = {
  finding_chart: "Finding chart",
  ephemeris: "Ephemeris table",
  justification: "Justification",
  other: "Other",
};

import { formatUt } from "@/lib/time/format";

export class DecisionError extends Error {
  constructor(
    message: string,
    readonly status: 404 | 409 | 400 = 409,
  ) {
    super(message);
  }
}

/** Another override took (part of) the slot first: the director must look again. */
export class SlotTakenError extends DecisionError {
  constructor(detail = "") {
    super(`Another override was approved in this slot a moment ago${detail}. Nothing was changed: look at the fresh impact and choose again.`, 409);
  }
}

/** The PI's deadline passed before anyone decided: the request lapses instead, and an override now would be of no use. */
export class DeadlinePassedError extends DecisionError {
  constructor(deadline: Date) {
    super(`The PI's deadline (${formatUt(deadline)} UT) has passed, so this request has lapsed and can no longer be approved. Nothing was changed.`, 409);
  }
}

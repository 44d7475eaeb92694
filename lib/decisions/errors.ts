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

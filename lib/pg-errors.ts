/** PostgreSQL's SQLSTATE codes for the constraint refusals the services turn into messages. */
interface PgError {
  code?: string;
  constraint?: string;
}

function pgCode(error: unknown): string | undefined {
  return typeof error === "object" && error !== null ? (error as PgError).code : undefined;
}

export function isUniqueViolation(error: unknown): boolean {
  return pgCode(error) === "23505";
}

export function isForeignKeyViolation(error: unknown): boolean {
  return pgCode(error) === "23503";
}

export function isCheckViolation(error: unknown): boolean {
  return pgCode(error) === "23514";
}

/**
 * Runs work and turns a unique-index refusal into the caller's error: the services check
 * codes first for a clear message, but a concurrent insert can still win the race.
 */
export async function refuseDuplicates<T>(work: () => Promise<T>, duplicate: () => Error): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (isUniqueViolation(error)) throw duplicate();
    throw error;
  }
}

import type { Trx } from "@/db/index";
import type { Role } from "@/db/types";
import { FieldError } from "@/lib/actions/domain-errors";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { findPeopleWithoutRole } from "./queries";

/** Refuses, beside `field`, people who do not hold `role` (a PI without the pi role, say). */
export async function assertPeopleHaveRole(trx: Trx, userIds: readonly string[], role: Role, field: string): Promise<void> {
  const without = await findPeopleWithoutRole(trx, userIds, role);
  const first = without[0];
  if (!first) return;
  const who = without.length === 1 ? first.name : `${first.name} and ${without.length - 1} more`;
  const verb = without.length === 1 ? "does" : "do";
  throw new FieldError(field, `${who} ${verb} not hold the ${ROLE_LABELS[role].toLowerCase()} role: give it on the Users and roles page first.`);
}

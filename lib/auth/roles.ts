import { ROLES, type Role } from "@/db/types";

export { ROLES, type Role };

export const ROLE_LABELS: Record<Role, string> = {
  pi: "Principal investigator",
  director: "Director",
  observer: "Observer",
  night_assistant: "Night assistant",
  admin: "Administrator",
};

export function hasAnyRole(roles: readonly Role[], wanted: readonly Role[]): boolean {
  return wanted.length === 0 || wanted.some((r) => roles.includes(r));
}

import type { Role } from "@/db/types";
import { hasAnyRole } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  /** Empty: every signed-in user. */
  roles: Role[];
}

export const NAV_ITEMS: NavItem[] = [
  { href: "/", label: "Home", roles: [] },
  { href: "/schedule", label: "Schedule", roles: [] },
  { href: "/feeds", label: "Calendar feeds", roles: [] },
  { href: "/admin", label: "Admin", roles: ["admin"] },
];

export function navFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => hasAnyRole(roles, item.roles));
}

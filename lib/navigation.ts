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
  { href: "/requests", label: "Requests", roles: ["pi"] },
  { href: "/review", label: "Review", roles: ["director"] },
  { href: "/ledger", label: "Ledger", roles: ["director", "admin", "pi", "observer"] },
  { href: "/tonight", label: "Tonight", roles: ["night_assistant", "director", "observer", "admin"] },
  { href: "/feeds", label: "Calendar feeds", roles: [] },
  { href: "/admin", label: "Admin", roles: ["admin"] },
  { href: "/settings", label: "Settings", roles: [] },
];

export function navFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => hasAnyRole(roles, item.roles));
}

import Link from "next/link";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { navFor } from "@/lib/navigation";
import type { Theme } from "@/lib/theme";
import type { User } from "@/lib/users/queries";
import { Logo } from "@/components/ui/logo";
import { NoticeBell } from "@/components/notices/notice-bell";
import { NavLinks } from "./nav-links";
import { SignOutButton } from "./sign-out-button";
import { ThemeToggle } from "./theme-toggle";

export function AppHeader({ user, theme }: { user: User; theme: Theme }) {
  return (
    <header className="border-b border-line bg-raised">
      <nav aria-label="Main" className="mx-auto flex max-w-7xl flex-wrap items-center gap-4 px-4 py-2">
        <Link href="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <Logo className="h-6 w-6" />
          Nightbreak
        </Link>
        <NavLinks items={navFor(user.roles)} />
        <div className="ml-auto flex items-center gap-4">
          <NoticeBell />
          <ThemeToggle initial={theme} />
          <div className="text-right leading-tight">
            <p className="text-sm">{user.name}</p>
            <p className="text-2xs text-muted">{user.roles.map((r) => ROLE_LABELS[r]).join(" · ")}</p>
          </div>
          <SignOutButton />
        </div>
      </nav>
    </header>
  );
}

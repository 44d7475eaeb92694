import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Administration" };

const SECTIONS = [
  { href: "/admin/users", title: "Users and roles", text: "Create accounts and decide who may do what." },
  { href: "/admin/sites", title: "Sites", text: "Where the telescopes stand: coordinates, height and time zone." },
  { href: "/admin/telescopes", title: "Telescopes", text: "Pointing limits, sun avoidance, setup time and night assistants." },
  { href: "/admin/instruments", title: "Instruments", text: "What each telescope carries and how faint it reaches." },
  { href: "/admin/semesters", title: "Semesters", text: "The allocation periods, in UT." },
  { href: "/admin/partners", title: "Partners", text: "The institutions that share the time." },
  { href: "/admin/programs", title: "Programs", text: "Allocated time, rank, PI, observers and whether ToO requests are allowed." },
  { href: "/admin/schedule-import", title: "Import a semester", text: "Load blocks from CSV or iCalendar, checked before anything is saved." },
];

export default async function AdminPage() {
  await requirePageRole("admin");
  return (
    <>
      <PageHeader title="Administration" />
      <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {SECTIONS.map((s) => (
          <li key={s.href}>
            <Link href={s.href} className="block rounded-lg border border-line bg-raised p-4 hover:bg-sunken">
              <span className="font-semibold">{s.title}</span>
              <span className="mt-1 block text-muted">{s.text}</span>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}

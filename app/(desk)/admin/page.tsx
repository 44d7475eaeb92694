import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Administration" };

const SECTIONS = [{ href: "/admin/users", title: "Users and roles", text: "Create accounts and decide who may do what." }];

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

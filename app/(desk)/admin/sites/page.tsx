import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { SiteForm } from "@/components/admin/site-form";
import { SitesTable } from "@/components/admin/sites-table";
import { PageHeader } from "@/components/ui/page-header";
import { singleParam } from "@/lib/search-params";
import { requirePageRole } from "@/lib/auth/session";
import { listSites } from "@/lib/sites/queries";
import { emptySiteForm, siteFormValues } from "@/lib/sites/schemas";
import { deleteSiteAction, saveSiteAction } from "./actions";

export const metadata: Metadata = { title: "Sites" };

export default async function SitesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const editId = singleParam((await searchParams).edit);
  const sites = await listSites(getDb());
  const editing = editId === undefined ? undefined : sites.find((s) => s.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The site you were editing no longer exists." : undefined;

  return (
    <>
      <PageHeader title="Sites">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit site ${editing.code}` : "New site"} cancelHref={editing ? "/admin/sites" : undefined} notice={gone}>
        <SiteForm key={editing?.id ?? "new"} siteId={editing?.id ?? null} initial={editing ? siteFormValues(editing) : emptySiteForm} action={saveSiteAction} />
      </EditorPanel>
      <SitesTable sites={sites} deleteAction={deleteSiteAction} />
    </>
  );
}

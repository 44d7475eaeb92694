import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { PartnerForm } from "@/components/admin/partner-form";
import { PartnersTable } from "@/components/admin/partners-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listPartners } from "@/lib/partners/queries";
import { emptyPartnerForm, partnerFormValues } from "@/lib/partners/schemas";
import { singleParam } from "@/lib/search-params";
import { deletePartnerAction, savePartnerAction } from "./actions";

export const metadata: Metadata = { title: "Partners" };

export default async function PartnersPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const editId = singleParam((await searchParams).edit);
  const partners = await listPartners(getDb());
  const editing = editId === undefined ? undefined : partners.find((p) => p.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The partner you were editing no longer exists." : undefined;

  return (
    <>
      <PageHeader title="Partners">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit partner ${editing.code}` : "New partner"} cancelHref={editing ? "/admin/partners" : undefined} notice={gone}>
        <PartnerForm key={editing?.id ?? "new"} partnerId={editing?.id ?? null} initial={editing ? partnerFormValues(editing) : emptyPartnerForm} action={savePartnerAction} />
      </EditorPanel>
      <PartnersTable partners={partners} deleteAction={deletePartnerAction} />
    </>
  );
}

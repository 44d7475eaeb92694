import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { peopleOptions } from "@/components/admin/people-options";
import { TelescopeForm } from "@/components/admin/telescope-form";
import { TelescopesTable } from "@/components/admin/telescopes-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { singleParam } from "@/lib/search-params";
import { listSiteOptions } from "@/lib/sites/queries";
import { listTelescopes } from "@/lib/telescopes/queries";
import { emptyTelescopeForm, telescopeFormValues } from "@/lib/telescopes/schemas";
import { listPeopleWithRole } from "@/lib/users/queries";
import { deleteTelescopeAction, saveTelescopeAction } from "./actions";

export const metadata: Metadata = { title: "Telescopes" };

export default async function TelescopesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const db = getDb();
  const editId = singleParam((await searchParams).edit);
  const [telescopes, sites, assistants] = await Promise.all([listTelescopes(db), listSiteOptions(db), listPeopleWithRole(db, "night_assistant")]);
  const editing = editId === undefined ? undefined : telescopes.find((t) => t.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The telescope you were editing no longer exists." : undefined;

  return (
    <>
      <PageHeader title="Telescopes">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit telescope ${editing.code}` : "New telescope"} cancelHref={editing ? "/admin/telescopes" : undefined} notice={gone}>
        <TelescopeForm
          key={editing?.id ?? "new"}
          telescopeId={editing?.id ?? null}
          initial={editing ? telescopeFormValues(editing) : emptyTelescopeForm}
          sites={sites.map((s) => ({ value: s.id, label: `${s.code} — ${s.name}` }))}
          assistants={peopleOptions(assistants, editing?.assistants)}
          action={saveTelescopeAction}
        />
      </EditorPanel>
      <TelescopesTable telescopes={telescopes} deleteAction={deleteTelescopeAction} />
    </>
  );
}

import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { peopleOptions } from "@/components/admin/people-options";
import { ProgramForm } from "@/components/admin/program-form";
import { ProgramsTable } from "@/components/admin/programs-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listPartnerOptions } from "@/lib/partners/queries";
import { listPrograms } from "@/lib/programs/queries";
import { emptyProgramForm, programFormValues } from "@/lib/programs/schemas";
import { singleParam } from "@/lib/search-params";
import { listSemesterOptions } from "@/lib/semesters/queries";
import { listPeopleWithRole } from "@/lib/users/queries";
import { deleteProgramAction, saveProgramAction } from "./actions";

export const metadata: Metadata = { title: "Programs" };

export default async function ProgramsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const db = getDb();
  const editId = singleParam((await searchParams).edit);
  const [programs, semesters, partners, pis, observers] = await Promise.all([
    listPrograms(db),
    listSemesterOptions(db),
    listPartnerOptions(db),
    listPeopleWithRole(db, "pi"),
    listPeopleWithRole(db, "observer"),
  ]);
  const editing = editId === undefined ? undefined : programs.find((p) => p.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The program you were editing no longer exists." : undefined;
  const currentPi = editing ? [{ id: editing.piUserId, name: editing.piName }] : [];

  return (
    <>
      <PageHeader title="Programs">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit program ${editing.code}` : "New program"} cancelHref={editing ? "/admin/programs" : undefined} notice={gone}>
        <ProgramForm
          key={editing?.id ?? "new"}
          programId={editing?.id ?? null}
          initial={editing ? programFormValues(editing) : emptyProgramForm}
          semesters={semesters.map((s) => ({ value: s.id, label: s.code }))}
          partners={partners.map((p) => ({ value: p.id, label: `${p.code} — ${p.name}` }))}
          pis={peopleOptions(pis, currentPi)}
          observers={peopleOptions(observers, editing?.observers)}
          action={saveProgramAction}
        />
      </EditorPanel>
      <ProgramsTable programs={programs} deleteAction={deleteProgramAction} />
    </>
  );
}

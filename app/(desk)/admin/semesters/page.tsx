import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { SemesterForm } from "@/components/admin/semester-form";
import { SemestersTable } from "@/components/admin/semesters-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { singleParam } from "@/lib/search-params";
import { listSemesters } from "@/lib/semesters/queries";
import { emptySemesterForm, semesterFormValues } from "@/lib/semesters/schemas";
import { deleteSemesterAction, saveSemesterAction } from "./actions";

export const metadata: Metadata = { title: "Semesters" };

export default async function SemestersPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const editId = singleParam((await searchParams).edit);
  const semesters = await listSemesters(getDb());
  const editing = editId === undefined ? undefined : semesters.find((s) => s.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The semester you were editing no longer exists." : undefined;

  return (
    <>
      <PageHeader title="Semesters">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit semester ${editing.code}` : "New semester"} cancelHref={editing ? "/admin/semesters" : undefined} notice={gone}>
        <SemesterForm
          key={editing?.id ?? "new"}
          semesterId={editing?.id ?? null}
          initial={editing ? semesterFormValues(editing) : emptySemesterForm}
          action={saveSemesterAction}
        />
      </EditorPanel>
      <SemestersTable semesters={semesters} deleteAction={deleteSemesterAction} />
    </>
  );
}

import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { AdminBackLink } from "@/components/admin/admin-back-link";
import { EditorPanel } from "@/components/admin/editor-panel";
import { InstrumentForm } from "@/components/admin/instrument-form";
import { InstrumentsTable } from "@/components/admin/instruments-table";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listInstruments } from "@/lib/instruments/queries";
import { emptyInstrumentForm, instrumentFormValues } from "@/lib/instruments/schemas";
import { singleParam } from "@/lib/search-params";
import { listTelescopeOptions } from "@/lib/telescopes/queries";
import { deleteInstrumentAction, saveInstrumentAction } from "./actions";

export const metadata: Metadata = { title: "Instruments" };

export default async function InstrumentsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageRole("admin");
  const db = getDb();
  const editId = singleParam((await searchParams).edit);
  const [instruments, telescopes] = await Promise.all([listInstruments(db), listTelescopeOptions(db)]);
  const editing = editId === undefined ? undefined : instruments.find((i) => i.id === editId);
  // A deleted record (perhaps deleted from this very page) leads back to the new form, not a 404.
  const gone = editId !== undefined && !editing ? "The instrument you were editing no longer exists." : undefined;

  return (
    <>
      <PageHeader title="Instruments">
        <AdminBackLink />
      </PageHeader>
      <EditorPanel title={editing ? `Edit instrument ${editing.telescopeCode} ${editing.code}` : "New instrument"} cancelHref={editing ? "/admin/instruments" : undefined} notice={gone}>
        <InstrumentForm
          key={editing?.id ?? "new"}
          instrumentId={editing?.id ?? null}
          initial={editing ? instrumentFormValues(editing) : emptyInstrumentForm}
          telescopes={telescopes.map((t) => ({ value: t.id, label: `${t.code} — ${t.name} (${t.siteCode})` }))}
          action={saveInstrumentAction}
        />
      </EditorPanel>
      <InstrumentsTable instruments={instruments} deleteAction={deleteInstrumentAction} />
    </>
  );
}

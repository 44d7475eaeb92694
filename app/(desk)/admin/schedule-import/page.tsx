import type { Metadata } from "next";
import { ScheduleImportForm } from "@/components/schedule-import/schedule-import-form";
import { ImportFormatHelp } from "@/components/schedule-import/import-format-help";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { checkImportAction, commitImportAction } from "./actions";

export const metadata: Metadata = { title: "Import the schedule" };

export default async function ScheduleImportPage() {
  await requirePageRole("admin");
  return (
    <>
      <PageHeader title="Import the schedule" />
      <p className="mb-4 max-w-3xl text-muted">
        Load a semester of blocks from a CSV or iCalendar file. Check the file first: every row that cannot be imported is
        listed with its line and the reason. The import adds all blocks in one step, or none at all.
      </p>
      <ScheduleImportForm check={checkImportAction} commit={commitImportAction} />
      <ImportFormatHelp />
    </>
  );
}

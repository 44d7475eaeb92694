import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { ScheduleCalendar } from "@/components/schedule/schedule-calendar";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listCalendarTelescopes } from "@/lib/schedule/calendar-queries";
import { getBlockEditorOptions } from "@/lib/schedule/editor-options";

export const metadata: Metadata = { title: "Schedule" };

export default async function SchedulePage({ searchParams }: { searchParams: Promise<{ telescope?: string }> }) {
  const user = await requirePageRole();
  const canEdit = user.roles.includes("admin");
  const db = getDb();
  const [telescopes, options] = await Promise.all([listCalendarTelescopes(db), canEdit ? getBlockEditorOptions(db) : null]);
  const { telescope } = await searchParams;
  const initial = telescopes.find((t) => t.id === telescope || t.code === telescope) ?? telescopes[0];
  return (
    <>
      <PageHeader title="Consortium schedule" />
      <ScheduleCalendar telescopes={telescopes} initialTelescopeId={initial?.id ?? ""} canEdit={canEdit} options={options} />
    </>
  );
}

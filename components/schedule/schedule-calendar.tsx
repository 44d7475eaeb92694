"use client";

import type { DateSelectArg, DatesSetArg, EventClickArg, EventDropArg, EventInput } from "@fullcalendar/core";
import interactionPlugin, { type EventResizeDoneArg } from "@fullcalendar/interaction";
import luxonPlugin from "@fullcalendar/luxon3";
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import { useMemo, useState } from "react";
import { Alert } from "@/components/ui/alert";
import type { CalendarTelescope } from "@/lib/schedule/calendar-queries";
import { twilightBands } from "@/lib/schedule/twilight-bands";
import { localDate } from "@/lib/time/format";
import { BlockDetailPanel } from "./block-detail-panel";
import { KIND_COLORS, KIND_LABELS, TWILIGHT_COLORS } from "./kind-colors";
import { NewBlockForm, type NewBlockOptions } from "./new-block-form";
import { fetchJson, useSchedule } from "./use-schedule";

type Zone = "ut" | "local";

export function ScheduleCalendar({
  telescopes,
  initialTelescopeId,
  canEdit,
  options,
}: {
  telescopes: CalendarTelescope[];
  initialTelescopeId: string;
  canEdit: boolean;
  options: NewBlockOptions | null;
}) {
  const [telescopeId, setTelescopeId] = useState(initialTelescopeId);
  const [zone, setZone] = useState<Zone>("ut");
  const [range, setRange] = useState<{ from: string; to: string } | null>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [draft, setDraft] = useState<{ start: string; end: string } | null>(null);
  const [message, setMessage] = useState<{ tone: "error" | "ok"; text: string } | null>(null);
  const telescope = telescopes.find((t) => t.id === telescopeId) ?? telescopes[0];
  const { data, error, isLoading, mutate } = useSchedule(telescope?.id, range);

  const bands = useMemo(() => {
    if (!telescope || !range) return [];
    const site = { latitudeDeg: telescope.latitudeDeg, longitudeDeg: telescope.longitudeDeg, heightM: telescope.heightM, timeZone: telescope.timeZone };
    const from = localDate(new Date(new Date(range.from).getTime() - 86_400_000), telescope.timeZone);
    const to = localDate(new Date(range.to), telescope.timeZone);
    return twilightBands(site, from, to);
  }, [telescope, range]);

  const events = useMemo<EventInput[]>(() => {
    const blockEvents: EventInput[] = (data?.blocks ?? []).map((b) => ({
      id: b.id,
      title: `${b.programCode} · ${KIND_LABELS[b.kind]}${b.observerName ? ` · ${b.observerName}` : ""}`,
      start: b.startsAt,
      end: b.endsAt,
      backgroundColor: KIND_COLORS[b.kind].background,
      borderColor: KIND_COLORS[b.kind].background,
      textColor: KIND_COLORS[b.kind].text,
      classNames: [`block-kind-${b.kind}`],
    }));
    const bandEvents: EventInput[] = bands.map((band) => ({
      start: band.start,
      end: band.end,
      display: "background",
      backgroundColor: TWILIGHT_COLORS[band.level],
      classNames: [`twilight-${band.level}`],
    }));
    return [...bandEvents, ...blockEvents];
  }, [data, bands]);

  if (!telescope) return <Alert>No telescopes are set up yet.</Alert>;

  async function move(info: EventDropArg | EventResizeDoneArg) {
    const { event } = info;
    if (!event.start || !event.end) return info.revert();
    try {
      await fetchJson(`/api/v1/blocks/${event.id}`, {
        method: "PATCH",
        body: JSON.stringify({ startsAt: event.start.toISOString(), endsAt: event.end.toISOString() }),
      });
      setMessage({ tone: "ok", text: `Moved ${event.title.split(" · ")[0]}.` });
      await mutate();
    } catch (e) {
      info.revert();
      setMessage({ tone: "error", text: e instanceof Error ? e.message : "The block could not be moved." });
    }
  }

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-4">
        <label className="flex flex-col gap-1 text-xs font-semibold uppercase tracking-wide text-muted">
          Telescope
          <select
            className="rounded-md border border-line bg-raised px-2 py-1.5 text-sm font-normal normal-case tracking-normal text-text"
            value={telescope.id}
            onChange={(e) => {
              setTelescopeId(e.target.value);
              setSelectedId(null);
            }}
          >
            {telescopes.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name} — {t.siteName}
              </option>
            ))}
          </select>
        </label>
        <fieldset className="flex items-center gap-1 rounded-md border border-line bg-raised p-0.5 text-sm" aria-label="Times shown in">
          {(["ut", "local"] as const).map((z) => (
            <button
              key={z}
              type="button"
              aria-pressed={zone === z}
              onClick={() => setZone(z)}
              className={zone === z ? "rounded bg-text px-2 py-1 text-surface" : "rounded px-2 py-1 text-muted hover:text-text"}
            >
              {z === "ut" ? "UT" : `Site time (${telescope.timeZone})`}
            </button>
          ))}
        </fieldset>
        <p className="text-xs text-muted" aria-live="polite">
          {isLoading ? "Loading blocks…" : error ? "" : `${data?.blocks.length ?? 0} blocks in view`}
        </p>
        <Legend />
      </div>
      {error && <Alert tone="error">Could not load the schedule: {error.message} It will retry on its own.</Alert>}
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="schedule-calendar rounded-lg border border-line bg-raised p-2">
          <FullCalendar
            plugins={[timeGridPlugin, interactionPlugin, luxonPlugin]}
            initialView="nightWeek"
            // Columns run noon to noon: after midnight the night in progress began yesterday.
            initialDate={new Date(Date.now() - 12 * 3_600_000)}
            views={{
              nightWeek: { type: "timeGrid", duration: { days: 7 }, buttonText: "Week" },
              oneNight: { type: "timeGrid", duration: { days: 1 }, buttonText: "Night" },
            }}
            headerToolbar={{ left: "prev,next today", center: "title", right: "nightWeek,oneNight" }}
            // Columns run noon to noon, so a whole night sits in one column.
            slotMinTime="12:00:00"
            slotMaxTime="36:00:00"
            // A column is a night, named by the date it begins (its early hours fall on the next date).
            dayHeaderContent={(arg) => `Night of ${arg.text}`}
            slotDuration="00:30:00"
            scrollTime="18:00:00"
            allDaySlot={false}
            nowIndicator
            height={720}
            timeZone={zone === "ut" ? "UTC" : telescope.timeZone}
            eventTimeFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
            slotLabelFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
            events={events}
            editable={canEdit}
            eventDurationEditable={canEdit}
            selectable={canEdit}
            selectMirror
            eventDrop={move}
            eventResize={move}
            select={(info: DateSelectArg) => {
              setDraft({ start: info.start.toISOString(), end: info.end.toISOString() });
              setSelectedId(null);
            }}
            eventClick={(info: EventClickArg) => {
              if (info.event.display === "background") return;
              setSelectedId(info.event.id);
              setDraft(null);
            }}
            datesSet={(arg: DatesSetArg) => setRange({ from: arg.start.toISOString(), to: arg.end.toISOString() })}
          />
        </div>
        <aside className="flex flex-col gap-3">
          {draft && options ? (
            <NewBlockForm
              telescope={telescope}
              start={draft.start}
              end={draft.end}
              options={options}
              onDone={async (text) => {
                setDraft(null);
                setMessage({ tone: "ok", text });
                await mutate();
              }}
              onCancel={() => setDraft(null)}
            />
          ) : selectedId ? (
            <BlockDetailPanel
              id={selectedId}
              canEdit={canEdit}
              onClose={() => setSelectedId(null)}
              onDeleted={async () => {
                setSelectedId(null);
                setMessage({ tone: "ok", text: "Block removed." });
                await mutate();
              }}
            />
          ) : (
            <p className="rounded-lg border border-dashed border-line p-4 text-muted">
              Select a block to see its program, people and history.{canEdit && " Drag across empty time to add a block; drag or stretch a block to move it."}
            </p>
          )}
        </aside>
      </div>
    </div>
  );
}

function Legend() {
  return (
    <ul className="ml-auto flex flex-wrap items-center gap-3 text-2xs text-muted" aria-label="Legend">
      {(Object.keys(KIND_COLORS) as Array<keyof typeof KIND_COLORS>).map((kind) => (
        <li key={kind} className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-2.5 rounded-sm" style={{ background: KIND_COLORS[kind].background }} />
          {KIND_LABELS[kind]}
        </li>
      ))}
      <li className="flex items-center gap-1">
        <span className="inline-block h-2.5 w-6 rounded-sm bg-gradient-to-r from-dusk-1 to-dusk-4" />
        Twilight → night
      </li>
    </ul>
  );
}

"use client";

/**
 * The chosen slot on a small time-grid of its night (noon to noon, UT): the telescope's
 * blocks in their kind colours, twilight shading, and the slot in the override flare.
 * Drag or stretch the slot, or drag across empty time, to adjust it.
 */
import type { DateSelectArg, EventDropArg, EventInput } from "@fullcalendar/core";
import interactionPlugin, { type EventResizeDoneArg } from "@fullcalendar/interaction";
import luxonPlugin from "@fullcalendar/luxon3";
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import { useEffect, useMemo, useRef } from "react";
import { KIND_COLORS, KIND_LABELS, TWILIGHT_COLORS } from "@/components/schedule/kind-colors";
import { useSchedule } from "@/components/schedule/use-schedule";
import type { CalendarTelescope } from "@/lib/schedule/calendar-queries";
import { twilightBands } from "@/lib/schedule/twilight-bands";
import { localDate } from "@/lib/time/format";
import type { SlotChoice } from "./use-impact";

const HOUR = 3_600_000;
/** The UT date whose noon-to-noon column holds the slot. */
const columnDate = (t: number) => new Date(t - 12 * HOUR).toISOString().slice(0, 10);

export function SlotGrid({ slot, telescope, onChange }: { slot: SlotChoice; telescope: CalendarTelescope | undefined; onChange: (slot: SlotChoice) => void }) {
  const calendar = useRef<FullCalendar>(null);
  const day = columnDate(slot.start);
  const from = Date.parse(`${day}T12:00:00Z`);
  const range = useMemo(() => ({ from: new Date(from).toISOString(), to: new Date(from + 24 * HOUR).toISOString() }), [from]);
  const { data } = useSchedule(telescope?.id, range);

  // Keep the slot in view: its night's column, scrolled to an hour before it starts.
  const scrollTo = Math.max(12 * HOUR, slot.start - Date.parse(`${day}T00:00:00Z`) - HOUR);
  useEffect(() => {
    const api = calendar.current?.getApi();
    api?.gotoDate(day);
    api?.scrollToTime({ milliseconds: scrollTo });
  }, [day, scrollTo]);

  const events = useMemo<EventInput[]>(() => {
    const bands: EventInput[] = telescope
      ? twilightBands({ latitudeDeg: telescope.latitudeDeg, longitudeDeg: telescope.longitudeDeg, heightM: telescope.heightM, timeZone: telescope.timeZone }, localDate(new Date(from - 12 * HOUR), telescope.timeZone), localDate(new Date(from + 12 * HOUR), telescope.timeZone)).map((b) => ({
          start: b.start,
          end: b.end,
          display: "background",
          backgroundColor: TWILIGHT_COLORS[b.level],
        }))
      : [];
    const blocks: EventInput[] = (data?.blocks ?? []).map((b) => ({
      id: b.id,
      title: `${b.programCode} · ${KIND_LABELS[b.kind]}`,
      start: b.startsAt,
      end: b.endsAt,
      editable: false,
      backgroundColor: KIND_COLORS[b.kind].background,
      borderColor: KIND_COLORS[b.kind].background,
      textColor: KIND_COLORS[b.kind].text,
      classNames: [`block-kind-${b.kind}`, "opacity-70"],
    }));
    const chosen: EventInput = {
      id: "chosen-slot",
      title: "Chosen slot",
      start: slot.start,
      end: slot.end,
      editable: true,
      overlap: true,
      // The override flare, see-through so the blocks it would displace show beneath.
      backgroundColor: "rgba(232, 101, 12, 0.6)",
      borderColor: KIND_COLORS.too.background,
      textColor: KIND_COLORS.too.text,
      classNames: ["chosen-slot"],
    };
    return [...bands, ...blocks, chosen];
  }, [data, slot.start, slot.end, telescope, from]);

  const moved = (info: EventDropArg | EventResizeDoneArg) => {
    const { start, end } = info.event;
    if (!start || !end) return info.revert();
    onChange({ ...slot, start: start.getTime(), end: end.getTime() });
  };

  return (
    <div role="group" className="schedule-calendar slot-grid rounded-md border border-line p-1" aria-label="The slot on its night's schedule, hours in UT">
      <FullCalendar
        ref={calendar}
        plugins={[timeGridPlugin, interactionPlugin, luxonPlugin]}
        initialView="oneNight"
        initialDate={day}
        views={{ oneNight: { type: "timeGrid", duration: { days: 1 } } }}
        headerToolbar={false}
        slotMinTime="12:00:00"
        slotMaxTime="36:00:00"
        slotDuration="00:30:00"
        snapDuration="00:05:00"
        scrollTime={{ milliseconds: scrollTo }}
        allDaySlot={false}
        dayHeaders
        height={360}
        nowIndicator
        timeZone="UTC"
        eventTimeFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
        slotLabelFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
        events={events}
        selectable
        eventDrop={moved}
        eventResize={moved}
        select={(info: DateSelectArg) => onChange({ ...slot, start: info.start.getTime(), end: info.end.getTime() })}
      />
    </div>
  );
}

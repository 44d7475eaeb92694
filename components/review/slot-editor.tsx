"use client";

/** The slot as numbers a director can adjust: telescope, start and end in UT. */
import { Field, inputClass } from "@/components/ui/field";
import { parseUtInstant, toUtInputValue } from "@/lib/validation/fields";
import { formatDuration } from "@/lib/time/format";
import type { SlotChoice } from "./use-impact";

export function SlotEditor({
  slot,
  telescopes,
  onChange,
}: {
  slot: SlotChoice;
  telescopes: Array<{ id: string; code: string; name: string }>;
  onChange: (slot: SlotChoice) => void;
}) {
  const set = (field: "start" | "end", text: string) => {
    const at = parseUtInstant(text);
    if (!at) return;
    onChange({ ...slot, [field]: at.getTime() });
  };
  const minutes = (slot.end - slot.start) / 60_000;
  return (
    // The telescope on a row of its own: a date and time input needs half the panel's width.
    <fieldset className="grid grid-cols-1 gap-3 sm:grid-cols-2">
      <legend className="sr-only">The slot to approve</legend>
      <Field id="slot-telescope" label="Telescope" className="sm:col-span-2">
        <select id="slot-telescope" className={inputClass} value={slot.telescopeId} onChange={(e) => onChange({ ...slot, telescopeId: e.target.value })}>
          {telescopes.map((t) => (
            <option key={t.id} value={t.id}>
              {t.code} — {t.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="slot-start" label="Slot start (UT)">
        <input id="slot-start" type="datetime-local" className={`${inputClass} num`} value={toUtInputValue(new Date(slot.start))} onChange={(e) => set("start", e.target.value)} />
      </Field>
      <Field id="slot-end" label="Slot end (UT)" error={minutes <= 0 ? "The slot must end after it starts." : undefined} hint={minutes > 0 ? `${formatDuration(minutes)}` : undefined}>
        <input id="slot-end" type="datetime-local" className={`${inputClass} num`} aria-invalid={minutes <= 0} value={toUtInputValue(new Date(slot.end))} onChange={(e) => set("end", e.target.value)} />
      </Field>
    </fieldset>
  );
}

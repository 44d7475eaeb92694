"use client";

import { KIND_LABELS } from "@/components/schedule/kind-colors";
import { cn } from "@/lib/cn";
import type { TonightQueue } from "@/lib/tonight/types";
import { clockLocal, clockUt } from "./time-format";
import { useNow } from "./use-tonight-queue";

const HOUR = 3_600_000;
const MARGIN = 30 * 60_000;

/** What the timeline spans: sunset to sunrise with a margin, widened to every block, within the night. */
export function timelineRange(queue: TonightQueue): { start: number; end: number } {
  const { night, blocks } = queue;
  let start = (night.sunset ? Date.parse(night.sunset) : Date.parse(night.start)) - MARGIN;
  let end = (night.sunrise ? Date.parse(night.sunrise) : Date.parse(night.end)) + MARGIN;
  for (const b of blocks) {
    start = Math.min(start, Date.parse(b.startsAt));
    end = Math.max(end, Date.parse(b.endsAt));
  }
  return { start: Math.max(start, Date.parse(night.start)), end: Math.min(end, Date.parse(night.end)) };
}

/**
 * Hour labels a narrow strip has no room for (a phone): every second one below 48rem,
 * every third below 24rem, so that "21:30" labels do not run into each other.
 */
function thinTicks(i: number): string {
  return cn(i % 3 !== 0 && "@max-[24rem]:invisible", i % 2 !== 0 && "@min-[24rem]:@max-[48rem]:invisible");
}

/**
 * The local night as a strip: twilight bands stacked so they darken towards full night,
 * the blocks in a lane below, hour ticks in UT above and site time below, and a now-marker.
 * A picture of the queue below it (which carries the same facts as text).
 */
export function NightTimeline({ queue }: { queue: TonightQueue }) {
  const { start, end } = timelineRange(queue);
  const now = useNow(queue.now, 30_000);
  const span = end - start;
  const x = (t: number) => `${(((Math.min(Math.max(t, start), end) - start) / span) * 100).toFixed(3)}%`;
  const width = (a: number, b: number) => `${(((Math.min(b, end) - Math.max(a, start)) / span) * 100).toFixed(3)}%`;
  const tz = queue.telescope.timeZone;
  const ticks: number[] = [];
  for (let t = Math.ceil(start / HOUR) * HOUR; t <= end; t += HOUR) ticks.push(t);
  const nowIn = now >= start && now <= end;
  const sunset = queue.night.sunset;
  const sunrise = queue.night.sunrise;

  return (
    <figure className="rounded-lg border border-line bg-raised p-3">
      <figcaption className="sr-only">
        Timeline of the night
        {sunset && sunrise ? ` from sunset at ${clockUt(sunset)} UT to sunrise at ${clockUt(sunrise)} UT` : ""}, with {queue.blocks.length} blocks. The queue below lists
        them.
      </figcaption>
      <div aria-hidden="true" className="@container grid select-none grid-cols-[3rem_1fr] gap-x-2">
        <span className="self-center text-xs text-muted">UT</span>
        <div className="relative h-6 text-sm">
          {ticks.map((t, i) => (
            <span key={t} className={cn("num absolute -translate-x-1/2 text-muted", thinTicks(i))} style={{ left: x(t) }}>
              {clockUt(new Date(t).toISOString()).slice(0, 2)}
            </span>
          ))}
        </div>
        <span />
        <div className="relative h-24 overflow-hidden rounded border border-line bg-sunken" data-testid="night-timeline">
          {queue.night.bands.map((b) => (
            <div key={b.level} className={`tn-band-${b.level} absolute inset-y-0`} style={{ left: x(Date.parse(b.start)), width: width(Date.parse(b.start), Date.parse(b.end)) }} />
          ))}
          {ticks.map((t) => (
            <div key={t} className="absolute inset-y-0 w-px bg-line opacity-60" style={{ left: x(t) }} />
          ))}
          {queue.blocks.map((b) => (
            <div
              key={b.id}
              title={`${b.programCode} · ${KIND_LABELS[b.kind]} · ${clockUt(b.startsAt)}–${clockUt(b.endsAt)} UT`}
              className={cn(
                `tn-kind-${b.kind} absolute bottom-2 top-9 overflow-hidden whitespace-nowrap rounded px-1.5 text-sm font-semibold leading-[2.5rem]`,
                b.changed && "tn-changed",
                (b.state === "done" || b.state === "aborted") && "opacity-60",
              )}
              style={{ left: x(Date.parse(b.startsAt)), width: width(Date.parse(b.startsAt), Date.parse(b.endsAt)) }}
            >
              {b.too ? b.too.targetName : b.programCode}
            </div>
          ))}
          {nowIn && (
            <div className="absolute inset-y-0" style={{ left: x(now) }} data-testid="now-marker">
              <div className="tn-now absolute inset-y-0 w-0.5 -translate-x-1/2" />
              <span className="tn-now-label num absolute left-1 top-0.5 text-xs font-semibold">now {clockUt(new Date(now).toISOString())}</span>
            </div>
          )}
        </div>
        <span className="self-center text-xs text-muted">Local</span>
        <div className="relative h-6 text-sm">
          {ticks.map((t, i) => (
            <span key={t} className={cn("num absolute -translate-x-1/2 text-muted", thinTicks(i))} style={{ left: x(t) }}>
              {clockLocal(new Date(t).toISOString(), tz).slice(0, 5)}
            </span>
          ))}
        </div>
      </div>
    </figure>
  );
}

import type { QueueNight } from "@/lib/tonight/types";
import { TimePair } from "./time-pair";

const EVENTS: Array<{ key: keyof QueueNight; label: string }> = [
  { key: "sunset", label: "Sunset" },
  { key: "civilDusk", label: "Civil dusk (−6°)" },
  { key: "nauticalDusk", label: "Nautical dusk (−12°)" },
  { key: "astronomicalDusk", label: "Astronomical dusk (−18°)" },
  { key: "astronomicalDawn", label: "Astronomical dawn (−18°)" },
  { key: "nauticalDawn", label: "Nautical dawn (−12°)" },
  { key: "civilDawn", label: "Civil dawn (−6°)" },
  { key: "sunrise", label: "Sunrise" },
];

/** Sunset, twilight and sunrise, in UT and site time; an event the night does not have says so. */
export function NightEvents({ night, timeZone }: { night: QueueNight; timeZone: string }) {
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-2 lg:grid-cols-4" aria-label="Sunset, twilight and sunrise">
      {EVENTS.map(({ key, label }) => {
        const at = night[key];
        return (
          <div key={key} className="flex flex-col">
            <dt className="text-sm text-muted">{label}</dt>
            <dd>{typeof at === "string" ? <TimePair at={at} timeZone={timeZone} /> : <span className="text-muted">does not happen</span>}</dd>
          </div>
        );
      })}
    </dl>
  );
}

"use client";

/**
 * Airmass against time (UT) for one night at one telescope: the target's curve, the Moon's,
 * the telescope's airmass limit, twilight drawn as bands that darken from sunset to
 * astronomical night, and the observable windows in the override flare. Drawn with
 * Chart.js; the canvas carries a text summary for screen readers, and the same windows
 * are listed in the table beside it.
 */
import { CategoryScale, Chart as ChartJS, Legend, LinearScale, LineController, LineElement, PointElement, Tooltip, type ChartData, type ChartOptions, type Plugin } from "chart.js";
import { useMemo } from "react";
import { Line } from "react-chartjs-2";
import type { FeasibilityWindow, SkyNight } from "@/lib/requests/feasibility/types";
import { airmassKastenYoung } from "@/lib/sky/airmass";
import { formatUt } from "@/lib/time/format";

ChartJS.register(LineController, LineElement, PointElement, LinearScale, CategoryScale, Tooltip, Legend);

type Point = { x: number; y: number | null };

const BAND_COLOURS = {
  sunset: "rgba(77, 106, 148, 0.16)",
  civil: "rgba(48, 70, 111, 0.2)",
  nautical: "rgba(29, 44, 76, 0.24)",
  astronomical: "rgba(14, 23, 48, 0.3)",
} as const;
const FLARE = "#e8650c";
const TARGET = "#4f6fa8";
const MOON = "#8a8f99";

const clock = (t: number) => `${formatUt(new Date(t)).slice(11)}`;
const at = (m: { utc: string } | null) => (m ? Date.parse(m.utc) : null);

interface Band {
  from: number;
  to: number;
  colour: string;
}

/** The part of the night below each twilight level; bands nest, so stacking them darkens toward the middle. */
function twilightBands(sky: SkyNight, start: number, end: number): Band[] {
  const tw = sky.twilight;
  const levels: [keyof typeof BAND_COLOURS, number | null, number | null, number][] = [
    ["sunset", at(tw.sunset), at(tw.sunrise), -0.833],
    ["civil", at(tw.civilDusk), at(tw.civilDawn), -6],
    ["nautical", at(tw.nauticalDusk), at(tw.nauticalDawn), -12],
    ["astronomical", at(tw.astronomicalDusk), at(tw.astronomicalDawn), -18],
  ];
  const bands: Band[] = [];
  for (const [level, dusk, dawn, altitude] of levels) {
    if (dusk === null && dawn === null) {
      // No crossing: the Sun stays below this level all night, or never reaches it.
      if (tw.sunAltitudeAtMidnightDeg < altitude) bands.push({ from: start, to: end, colour: BAND_COLOURS[level] });
      continue;
    }
    bands.push({ from: dusk ?? start, to: dawn ?? end, colour: BAND_COLOURS[level] });
  }
  return bands;
}

function backgroundPlugin(bands: Band[], windows: { from: number; to: number }[]): Plugin<"line"> {
  return {
    id: "nightbreakBackground",
    beforeDatasetsDraw(chart) {
      const { ctx, chartArea, scales } = chart;
      const x = scales.x;
      if (!x) return;
      const px = (t: number) => Math.min(chartArea.right, Math.max(chartArea.left, x.getPixelForValue(t)));
      ctx.save();
      for (const band of bands) {
        ctx.fillStyle = band.colour;
        ctx.fillRect(px(band.from), chartArea.top, px(band.to) - px(band.from), chartArea.bottom - chartArea.top);
      }
      for (const w of windows) {
        ctx.fillStyle = "rgba(232, 101, 12, 0.2)";
        ctx.fillRect(px(w.from), chartArea.top, px(w.to) - px(w.from), chartArea.bottom - chartArea.top);
        ctx.fillStyle = FLARE;
        ctx.fillRect(px(w.from), chartArea.bottom - 4, px(w.to) - px(w.from), 4);
      }
      ctx.restore();
    },
  };
}

const HOUR_MS = 3_600_000;

/** Tick instants on whole UT hours from `first` to `last`, one or two hours apart. */
export function hourTicks(first: number, last: number): number[] {
  const step = last - first > 8 * HOUR_MS ? 2 * HOUR_MS : HOUR_MS;
  const ticks: number[] = [];
  for (let t = Math.ceil(first / step) * step; t <= last; t += step) ticks.push(t);
  return ticks;
}

export function AirmassChart({
  sky,
  windows,
  airmassLimit,
  targetName,
  telescopeCode,
  textColour = "#555c6a",
}: {
  sky: SkyNight;
  windows: FeasibilityWindow[];
  airmassLimit: number;
  targetName: string;
  telescopeCode: string;
  textColour?: string;
}) {
  const times = sky.samples.t;
  const first = times[0] ?? 0;
  const last = times[times.length - 1] ?? first + 1;
  const yMax = Math.min(5, Math.max(3, Math.ceil((airmassLimit + 0.5) * 2) / 2));

  const { data, options, plugins, label } = useMemo(() => {
    const target: Point[] = times.map((t, i) => {
      const a = sky.samples.airmass[i] ?? null;
      return { x: t, y: a === null || a > 10 ? null : a };
    });
    const moon: Point[] = times.map((t, i) => {
      const m = airmassKastenYoung(sky.samples.moonAltitudeDeg[i] ?? -90);
      return { x: t, y: m === null || m > 10 ? null : m };
    });
    const inNight = windows
      .map((w) => ({ from: Date.parse(w.start), to: Date.parse(w.end) }))
      .filter((w) => w.to > first && w.from < last);
    const chartData: ChartData<"line", Point[]> = {
      datasets: [
        { label: targetName || "Target", data: target, borderColor: TARGET, backgroundColor: TARGET, borderWidth: 2, pointRadius: 0, spanGaps: false },
        {
          label: `Moon (${Math.round(sky.moonIllumination * 100)}% lit)`,
          data: moon,
          borderColor: MOON,
          backgroundColor: MOON,
          borderDash: [4, 4],
          borderWidth: 1.5,
          pointRadius: 0,
          spanGaps: false,
        },
        {
          label: `Airmass limit ${airmassLimit.toFixed(2)}`,
          data: [
            { x: first, y: airmassLimit },
            { x: last, y: airmassLimit },
          ],
          borderColor: "#b3261e",
          backgroundColor: "#b3261e",
          borderDash: [6, 3],
          borderWidth: 1.5,
          pointRadius: 0,
        },
      ],
    };
    const chartOptions: ChartOptions<"line"> = {
      responsive: true,
      maintainAspectRatio: false,
      animation: false,
      parsing: false,
      interaction: { mode: "nearest", axis: "x", intersect: false },
      scales: {
        x: {
          type: "linear",
          min: first,
          max: last,
          // Whole UT hours (every two on a long night; Chart.js drops some evenly when narrow): its own spacing drifts off the hour.
          afterBuildTicks: (axis) => {
            axis.ticks = hourTicks(first, last).map((value) => ({ value }));
          },
          ticks: { color: textColour, callback: (v) => clock(Number(v)), maxRotation: 0, autoSkipPadding: 8 },
          title: { display: true, text: "UT", color: textColour },
          grid: { color: "rgba(128, 128, 128, 0.15)" },
        },
        y: {
          type: "linear",
          reverse: true,
          min: 1,
          max: yMax,
          ticks: { color: textColour },
          title: { display: true, text: "Airmass", color: textColour },
          grid: { color: "rgba(128, 128, 128, 0.15)" },
        },
      },
      plugins: {
        legend: { labels: { color: textColour, boxWidth: 14 } },
        tooltip: {
          callbacks: {
            title: (items) => (items[0] ? `${formatUt(new Date(items[0].parsed.x ?? 0))} UT` : ""),
            label: (item) => `${item.dataset.label}: ${item.parsed.y === null ? "below the horizon" : (item.parsed.y ?? 0).toFixed(2)}`,
          },
        },
      },
    };
    const summary =
      inNight.length === 0
        ? "no observable window"
        : `observable ${inNight.map((w) => `${clock(Math.max(w.from, first))}–${clock(Math.min(w.to, last))}`).join(", ")} UT`;
    return {
      data: chartData,
      options: chartOptions,
      plugins: [backgroundPlugin(twilightBands(sky, first, last), inNight)],
      label: `Airmass of ${targetName || "the target"} from ${telescopeCode} on the night of ${sky.nightOf}: ${summary}; limit ${airmassLimit.toFixed(2)}.`,
    };
  }, [sky, times, windows, airmassLimit, targetName, telescopeCode, textColour, first, last, yMax]);

  return (
    <div className="h-64 w-full">
      <Line data={data} options={options} plugins={plugins} role="img" aria-label={label} />
    </div>
  );
}

export function ChartKey() {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-2xs text-muted" aria-label="Chart key">
      <li className="flex items-center gap-1">
        <span className="inline-block h-2.5 w-4 rounded-sm" style={{ background: "rgba(232, 101, 12, 0.35)", borderBottom: `3px solid ${FLARE}` }} />
        observable window
      </li>
      {(
        [
          ["sunset", "Sun set"],
          ["civil", "Sun below −6°"],
          ["nautical", "below −12°"],
          ["astronomical", "below −18° (astronomical night)"],
        ] as const
      ).map(([level, text]) => (
        <li key={level} className="flex items-center gap-1">
          <span className="inline-block h-2.5 w-4 rounded-sm border border-line" style={{ background: BAND_COLOURS[level] }} />
          {text}
        </li>
      ))}
    </ul>
  );
}

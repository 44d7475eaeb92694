"use client";

/**
 * The fading clock: the moving target's predicted magnitude along its ephemeris against
 * the chosen instrument's limiting magnitude, and when it fades past it.
 */
import { Chart as ChartJS, Legend, LinearScale, LineController, LineElement, PointElement, Tooltip, type ChartData, type ChartOptions } from "chart.js";
import { useMemo } from "react";
import { Line } from "react-chartjs-2";
import type { FadingSummary } from "@/lib/requests/feasibility/types";
import { formatUt } from "@/lib/time/format";

ChartJS.register(LineController, LineElement, PointElement, LinearScale, Tooltip, Legend);

type Point = { x: number; y: number };

export function FadingClock({ fading, textColour = "#555c6a" }: { fading: FadingSummary; textColour?: string }) {
  const { data, options } = useMemo(() => {
    const first = fading.curve[0]?.t ?? 0;
    const last = fading.curve[fading.curve.length - 1]?.t ?? first + 1;
    const mags = fading.curve.map((p) => p.magnitude).concat(fading.limitingMagnitude);
    const chartData: ChartData<"line", Point[]> = {
      datasets: [
        { label: `Predicted V (${fading.source === "H-G" ? "H–G" : "ephemeris"})`, data: fading.curve.map((p) => ({ x: p.t, y: p.magnitude })), borderColor: "#4f6fa8", borderWidth: 2, pointRadius: 0 },
        {
          label: `Limit V = ${fading.limitingMagnitude.toFixed(1)}`,
          data: [
            { x: first, y: fading.limitingMagnitude },
            { x: last, y: fading.limitingMagnitude },
          ],
          borderColor: "#e8650c",
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
      scales: {
        x: {
          type: "linear",
          min: first,
          max: last,
          ticks: { color: textColour, maxTicksLimit: 6, callback: (v) => formatUt(new Date(Number(v))).slice(5, 16) },
          title: { display: true, text: "UT", color: textColour },
        },
        y: {
          type: "linear",
          reverse: true,
          suggestedMin: Math.floor(Math.min(...mags)) - 0.5,
          suggestedMax: Math.ceil(Math.max(...mags)) + 0.5,
          ticks: { color: textColour },
          title: { display: true, text: "V magnitude (brighter up)", color: textColour },
        },
      },
      plugins: { legend: { labels: { color: textColour, boxWidth: 14 } } },
    };
    return { data: chartData, options: chartOptions };
  }, [fading, textColour]);

  return (
    <section aria-labelledby="fading-clock-heading" className="flex flex-col gap-2">
      <h3 id="fading-clock-heading" className="text-sm font-semibold">
        Fading clock
      </h3>
      <p className="text-sm" role="status">
        {fading.reason}
      </p>
      <p className="num text-2xs text-muted">
        {fading.instrument} · V at the start {fading.magnitudeAtStart === null ? "unknown" : fading.magnitudeAtStart.toFixed(1)} · ephemeris ends{" "}
        {formatUt(new Date(fading.coverageEnd))} UT
      </p>
      {fading.curve.length > 1 && (
        <div className="h-48 w-full">
          <Line data={data} options={options} role="img" aria-label={`Predicted magnitude against the limit: ${fading.reason}`} />
        </div>
      )}
    </section>
  );
}

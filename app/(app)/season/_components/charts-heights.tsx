"use client";

import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SeasonSummary } from "@/lib/season/types";
import { AXIS, ChartFigure, SERIES } from "./chart-figure";
import { metresText, secondsText, weekText } from "./season-format";

type Props = { summary: SeasonSummary };

/** Launch heights (from altimeter logs) week by week: the median and the best launch. */
export function HeightByWeekChart({ summary }: Props) {
  const weeks = summary.heightByWeek ?? [];
  const launches = summary.heights?.launches ?? 0;
  const median = summary.heights?.medianM ?? null;
  return (
    <ChartFigure
      id="height-week" title="Launch height over time"
      sentence={launches === 0
        ? "Launch heights come from the altimeter logs uploaded on your runs; none within these filters."
        : `Each week's median launch height (solid) and best launch (dashed), over ${launches} launch${launches === 1 ? "" : "es"} an altimeter log matched to a flight. Median over them all: ${metresText(median)}.`}
      table={{ columns: ["Week", "Launches", "Median", "Best"], rows: weeks.map((w) => [weekText(w.week), w.launches, metresText(w.medianM), metresText(w.bestM)]) }}
    >
      <ResponsiveContainer>
        <LineChart data={weeks} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="week" tickFormatter={(w: string) => w.slice(5)} {...AXIS} />
          <YAxis unit=" m" width={52} {...AXIS} />
          <Tooltip />
          <Legend />
          <Line dataKey="medianM" name="Median" stroke={SERIES[0]} strokeWidth={2} dot isAnimationActive={false} />
          <Line dataKey="bestM" name="Best" stroke={SERIES[1]} strokeDasharray="5 4" dot isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

const binText = (b: SeasonSummary["heightVsTime"][number]) => (b.toM === null ? `${b.fromM} m and higher` : `${b.fromM}–${b.toM} m`);

/** Landed flights with a launch height, by 10 m of height: the median flight time, and the slope of time on height. */
export function HeightVsTimeChart({ summary }: Props) {
  const bins = summary.heightVsTime ?? [];
  const slope = summary.heights?.secondsPerTenMetres ?? null;
  const slopeText = slope === null ? "Two flights with a launch height are needed for a trend."
    : slope > 0 ? `Each 10 m more launch height went with ${slope.toFixed(1)} s more flight time.`
      : slope < 0 ? `Higher launches went with shorter flights here: ${(-slope).toFixed(1)} s less per 10 m.` : "Launch height made no difference to flight time here.";
  return (
    <ChartFigure
      id="height-time" title="Launch height and flight time"
      sentence={`Landed flights with a measured launch, grouped by launch height in 10 m steps: the median flight time of each group. ${slopeText}`}
      table={{ columns: ["Launch height", "Flights", "Median flight time"], rows: bins.map((b) => [binText(b), b.flights, secondsText(b.medianTenths)]) }}
    >
      <ResponsiveContainer>
        <BarChart data={bins.map((b) => ({ bin: binText(b), time: b.medianTenths / 10 }))} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="bin" {...AXIS} />
          <YAxis unit=" s" width={48} {...AXIS} />
          <Tooltip />
          <Bar dataKey="time" name="Median flight time" fill={SERIES[2]} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

"use client";

import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SeasonSummary } from "@/lib/season/types";
import { AXIS, ChartFigure, INK, SERIES } from "./chart-figure";
import { secondsText, shareText, taskText, weekText } from "./season-format";

type Props = { summary: SeasonSummary };
const short = (week: string) => week.slice(5);
const sec = (tenths: number) => Math.round(tenths) / 10;

/** Result as a share of the task's maximum, one line per task, week by week. */
export function ShareChart({ summary }: Props) {
  const tasks = [...new Set(summary.shareByWeek.map((s) => s.task))].sort();
  const byWeek = new Map<string, Record<string, number | string>>();
  for (const s of summary.shareByWeek) byWeek.set(s.week, { ...(byWeek.get(s.week) ?? { week: s.week }), [s.task]: Math.round(s.share * 1000) / 10 });
  const best = [...summary.shareByWeek].sort((a, b) => b.share - a.share)[0];
  return (
    <ChartFigure
      id="share" title="Result as a share of the task's maximum"
      sentence={`Each line is one task: the week's mean result as a percentage of what the task allows.${best ? ` Best: ${taskText(best.task)}, ${shareText(best.share)} in the ${weekText(best.week)}.` : ""}`}
      table={{ columns: ["Week", "Task", "Mean result", "Runs"], rows: summary.shareByWeek.map((s) => [weekText(s.week), taskText(s.task), shareText(s.share), s.runs]) }}
    >
      <ResponsiveContainer>
        <LineChart data={[...byWeek.values()]} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="week" tickFormatter={short} {...AXIS} />
          <YAxis domain={[0, 100]} unit="%" width={44} {...AXIS} />
          <Tooltip />
          <Legend />
          {tasks.map((t, i) => (
            <Line key={t} dataKey={t} name={taskText(t)} stroke={SERIES[i % SERIES.length]} strokeDasharray={i >= SERIES.length ? "4 3" : undefined} connectNulls dot={false} isAnimationActive={false} />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

/** Turnaround (landing to next launch in the same window): median and 90th percentile per week, and the trend. */
export function TurnaroundChart({ summary }: Props) {
  const trend = summary.turnaroundTrend;
  const trendText =
    trend === null ? "Two weeks are needed for a trend." : trend < 0 ? `The median is falling by ${secondsText(-trend)} a week.` : trend > 0 ? `The median is rising by ${secondsText(trend)} a week.` : "The median is flat.";
  return (
    <ChartFigure
      id="turnaround" title="Turnaround"
      sentence={`Time on the ground from a landing to the next launch in the same window: the week's median (solid) and the 90th percentile (dashed). ${trendText}`}
      table={{ columns: ["Week", "Median", "90th percentile", "Turnarounds"], rows: summary.turnaroundByWeek.map((t) => [weekText(t.week), secondsText(t.medianTenths), secondsText(t.p90Tenths), t.count]) }}
    >
      <ResponsiveContainer>
        <LineChart data={summary.turnaroundByWeek.map((t) => ({ week: t.week, median: sec(t.medianTenths), p90: sec(t.p90Tenths) }))} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="week" tickFormatter={short} {...AXIS} />
          <YAxis unit=" s" width={48} {...AXIS} />
          <Tooltip />
          <Legend />
          <Line dataKey="median" name="Median" stroke={SERIES[0]} strokeWidth={2} dot={false} isAnimationActive={false} />
          <Line dataKey="p90" name="90th percentile" stroke={SERIES[1]} strokeDasharray="5 4" dot={false} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

/** Launches per window, week by week. */
export function LaunchesChart({ summary }: Props) {
  const data = summary.launchesByWeek.map((l) => ({ week: l.week, perWindow: Math.round((l.launches / l.windows) * 10) / 10 }));
  return (
    <ChartFigure
      id="launches" title="Launches per window"
      sentence="How many times you launched in a window, on average over the week's windows."
      table={{ columns: ["Week", "Launches per window", "Windows", "Launches"], rows: summary.launchesByWeek.map((l, i) => [weekText(l.week), data[i]!.perWindow, l.windows, l.launches]) }}
    >
      <ResponsiveContainer>
        <BarChart data={data} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="week" tickFormatter={short} {...AXIS} />
          <YAxis allowDecimals={false} width={32} {...AXIS} />
          <Tooltip />
          <Bar dataKey="perWindow" name="Launches per window" fill={SERIES[0]} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

const CAUSES = [
  ["groundTime", "Ground time"], ["overCap", "Overshoot"], ["shortOfTarget", "Short flights"], ["other", "Invalid or not counted"],
] as const;

/** Points lost by cause per week (seconds), penalties beside them (points). */
export function LostChart({ summary }: Props) {
  const data = summary.lostByWeek.map((w) => ({
    week: w.week, groundTime: sec(w.groundTime), overCap: sec(w.overCap), shortOfTarget: sec(w.shortOfTarget), other: sec(w.invalid + w.notCounted + w.roundZero),
  }));
  const penalties = summary.lostByWeek.reduce((a, w) => a + w.penaltyPoints, 0);
  return (
    <ChartFigure
      id="lost" title="Points lost by cause"
      sentence={`Seconds each week's runs fell short of the tasks' maximum, by cause, as the run page's breakdown counts them. Penalties in these weeks: ${penalties} points.`}
      table={{
        columns: ["Week", ...CAUSES.map(([, label]) => label), "Penalty points"],
        rows: summary.lostByWeek.map((w, i) => [weekText(w.week), ...CAUSES.map(([key]) => `${data[i]![key].toFixed(1)} s`), w.penaltyPoints]),
      }}
    >
      <ResponsiveContainer>
        <BarChart data={data} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="week" tickFormatter={short} {...AXIS} />
          <YAxis unit=" s" width={56} {...AXIS} />
          <Tooltip />
          <Legend />
          {CAUSES.map(([key, label], i) => <Bar key={key} dataKey={key} name={label} stackId="lost" fill={SERIES[i]} stroke={INK} strokeWidth={0.5} isAnimationActive={false} />)}
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

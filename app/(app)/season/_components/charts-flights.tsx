"use client";

import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { SeasonSummary } from "@/lib/season/types";
import { AXIS, ChartFigure, SERIES } from "./chart-figure";
import { secondsText } from "./season-format";

type Props = { summary: SeasonSummary };

/** For each target (ladder steps, called targets): how far over and under it the flights landed. */
export function TargetsChart({ summary }: Props) {
  const data = summary.targets.map((t) => ({ target: `${t.targetSec} s`, over: t.meanOverTenths / 10, under: t.meanUnderTenths / 10 }));
  return (
    <ChartFigure
      id="targets" title="Target accuracy"
      sentence="For each target of the target tasks: the mean time flown past it (overshoot) and the mean time missing (undershoot), over the flights that missed that way."
      table={{
        columns: ["Target", "Flights", "Over", "Mean overshoot", "Under", "Mean undershoot"],
        rows: summary.targets.map((t) => [`${t.targetSec} s`, t.flights, t.over, secondsText(t.meanOverTenths), t.under, secondsText(t.meanUnderTenths)]),
      }}
    >
      <ResponsiveContainer>
        <BarChart data={data} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="target" {...AXIS} />
          <YAxis unit=" s" width={48} {...AXIS} />
          <Tooltip />
          <Legend />
          <Bar dataKey="over" name="Mean overshoot" fill={SERIES[1]} isAnimationActive={false} />
          <Bar dataKey="under" name="Mean undershoot" fill={SERIES[0]} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

const binText = (d: SeasonSummary["durations"][number]) => (d.toSec === null ? `${d.fromSec} s and longer` : `${d.fromSec}–${d.toSec} s`);

/** Landed flights by duration, in 30-second bins. */
export function DurationsChart({ summary }: Props) {
  const total = summary.durations.reduce((a, d) => a + d.flights, 0);
  const most = [...summary.durations].sort((a, b) => b.flights - a.flights)[0];
  return (
    <ChartFigure
      id="durations" title="Flight durations"
      sentence={`How long your ${total} landed flights lasted, in 30-second steps.${most ? ` Most were ${binText(most)}.` : ""}`}
      table={{ columns: ["Duration", "Flights"], rows: summary.durations.map((d) => [binText(d), d.flights]) }}
    >
      <ResponsiveContainer>
        <BarChart data={summary.durations.map((d) => ({ bin: binText(d), flights: d.flights }))} accessibilityLayer={false}>
          <CartesianGrid stroke="rgb(var(--line))" />
          <XAxis dataKey="bin" {...AXIS} />
          <YAxis allowDecimals={false} width={36} {...AXIS} />
          <Tooltip />
          <Bar dataKey="flights" name="Flights" fill={SERIES[0]} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </ChartFigure>
  );
}

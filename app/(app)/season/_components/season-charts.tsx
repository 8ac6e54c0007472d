"use client";

import type { SeasonSummary } from "@/lib/season/types";
import { DurationsChart, TargetsChart } from "./charts-flights";
import { HeightByWeekChart, HeightVsTimeChart } from "./charts-heights";
import { LaunchesChart, LostChart, ShareChart, TurnaroundChart } from "./charts-weekly";

/** The season's charts (loaded apart from the page: the drawing library is large). */
export default function SeasonCharts({ summary }: { summary: SeasonSummary }) {
  return (
    <section aria-labelledby="season-charts" className="space-y-8">
      <h2 id="season-charts" className="text-lg font-bold">Charts</h2>
      <ShareChart summary={summary} />
      <TurnaroundChart summary={summary} />
      <TargetsChart summary={summary} />
      <DurationsChart summary={summary} />
      <LaunchesChart summary={summary} />
      <LostChart summary={summary} />
      <HeightByWeekChart summary={summary} />
      <HeightVsTimeChart summary={summary} />
    </section>
  );
}

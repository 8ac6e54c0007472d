// One sentence that says what the lift timeline shows, for the heading of the
// strip and for screen readers. The caller passes how to print a time of day.
import { bestQuarter, type LiftBin } from "./lift-timeline";

export function describeLiftTimeline(
  bins: readonly LiftBin[],
  formatTime: (ms: number) => string,
): string {
  if (bins.length === 0) return "No flights were recorded this day, so there is no lift timeline.";
  const flights = bins.reduce((sum, b) => sum + b.flights, 0);
  const best = bestQuarter(bins);
  const counted = `${flights} ${flights === 1 ? "flight" : "flights"}`;
  const span =
    bins.length === 1
      ? `${counted} in the quarter hour from ${formatTime(bins[0]!.startMs)}`
      : `${counted} from ${formatTime(bins[0]!.startMs)} to ${formatTime(bins[bins.length - 1]!.startMs)}`;
  if (best === null) {
    return `${span}; no flight beat its pilot's usual time, so no quarter hour stands out.`;
  }
  return `${span}, by quarter hour, weighted by how far each flight beat its pilot's usual time; the best air came at ${formatTime(best.startMs)}.`;
}

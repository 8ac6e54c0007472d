import { secondsText } from "@/lib/tasks/time";
import type { RoundCell } from "./standings";

/**
 * What a results row says of a round with a re-flown result (F3K.9.6): both results in seconds (an
 * unsigned one as 0, F3K.1.2) and which one counted, e.g. "original 150.0 s, re-flight 100.0 s:
 * re-flight counted". Null for a round without a re-flight result. The CSV and the PDF print it.
 */
export function reflightNote(c: Pick<RoundCell, "reflight">): string | null {
  if (!c.reflight) return null;
  const { originalTenths, reflightTenths, stands } = c.reflight;
  return `original ${secondsText(originalTenths)} s, re-flight ${secondsText(reflightTenths)} s: ${stands === "reflight" ? "re-flight" : "original"} counted`;
}

import { END_CALL_LABEL, HALVES_LABEL, ruleSettingsOf, type TaskDefinition } from "@/lib/tasks";

const minutes = (sec: number) => (sec % 60 === 0 ? `${sec / 60} min` : `${sec} s`);
const list = (secs: readonly number[]) => secs.join(", ") + " s";

/**
 * One line saying what a task asks, read from its definition (so a custom task gets one
 * too), e.g. "10 min · 4 longest flights against 240, 180, 120, 60 s, any order".
 */
export function describeTask(def: TaskDefinition): string {
  if (def.kind === "all-up") {
    return `${def.attempts} attempts · all launch together within ${def.launchWindowMs / 1000} s of the signal · up to ${def.capSec} s each`;
  }
  const head = minutes(def.workingTimeSec);
  if (def.kind === "poker") {
    return `${head} · call a target before each launch; up to ${def.maxTargets} reached targets count`;
  }
  const launches = def.launchLimit === null ? "" : ` · ${def.launchLimit} launch${def.launchLimit === 1 ? "" : "es"}`;
  if (def.ladder) {
    const steps = def.ladder.targetsSec;
    if (def.ladder.order === "in-order") return `${head}${launches} · flight by flight against ${list(steps)}, in order`;
    const longestFirst = [...steps].sort((a, b) => b - a);
    return `${head}${launches} · ${steps.length} longest flights against ${list(longestFirst)}, any order`;
  }
  const cap = def.capSec === null ? "no cap" : `up to ${def.capSec} s each`;
  const c = def.counting;
  const what =
    c.rule === "all"
      ? "every flight counts"
      : c.rule === "best"
        ? c.n === 1
          ? "the longest flight counts"
          : `the ${c.n} longest flights count`
        : c.n === 1
          ? "only the last flight counts"
          : `the last ${c.n} flights count`;
  return `${head}${launches} · ${what}, ${cap}`;
}

/** The scoring choices stored with the task, e.g. "Normalised scores: exact halves round up". */
export function describeRuleSettings(def: TaskDefinition): string {
  const s = ruleSettingsOf(def);
  const halves = `Normalised scores: ${HALVES_LABEL[s.halves].toLowerCase()}`;
  return def.kind === "poker" ? `${halves} · End of working time call: ${END_CALL_LABEL[s.endCall].toLowerCase()}` : halves;
}

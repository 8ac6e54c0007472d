import type { AllUpTask, PokerTask, TaskDefinition, TaskLetter, WindowTask } from "./definition";

/**
 * The built-in task catalogue of the 2025 edition (FAI Sporting Code, Volume F3 Soaring,
 * 2025 v2, F3K.11; digest in RULES.md). Each entry is a complete definition that a run
 * copies whole; `variants` lists the working-time choices the rulebook gives.
 */
export const CATALOGUE_EDITION = "F3K-2025" as const;

const LANDING_WINDOW_SEC = 30; // F3K.7

function windowTask(
  letter: TaskLetter,
  name: string,
  workingTimeSec: number,
  parts: Pick<WindowTask, "launchLimit" | "counting" | "capSec" | "ladder">,
): WindowTask {
  return {
    edition: CATALOGUE_EDITION,
    letter,
    name,
    kind: "window",
    workingTimeSec,
    landingWindowSec: LANDING_WINDOW_SEC,
    sumCap: true,
    ...parts,
  };
}

function poker(workingTimeSec: number): PokerTask {
  return {
    edition: CATALOGUE_EDITION,
    letter: "E",
    name: "Poker (variable target time)",
    kind: "poker",
    workingTimeSec,
    landingWindowSec: LANDING_WINDOW_SEC,
    maxTargets: 3,
    endCall: "flown",
    sumCap: true,
  };
}

function allUp(attempts: number): AllUpTask {
  return {
    edition: CATALOGUE_EDITION,
    letter: "C",
    name: "All up, last down",
    kind: "all-up",
    attempts,
    launchWindowMs: 3000,
    landingDeadlineSec: 213, // landing window 3:03–3:33 after the signal
    capSec: 180,
  };
}

const capped = (capSec: number, counting: WindowTask["counting"], launchLimit: number | null = null) => ({
  launchLimit,
  counting,
  capSec,
  ladder: null,
});

/** Every variant of every task, keyed by letter; the first variant is the default. */
export const CATALOGUE: Readonly<Record<TaskLetter, readonly TaskDefinition[]>> = {
  A: [600, 420].map((wt) => windowTask("A", "Last flight", wt, capped(300, { rule: "last", n: 1 }))),
  B: [
    windowTask("B", "Next to last and last flight", 600, capped(240, { rule: "last", n: 2 })),
    windowTask("B", "Next to last and last flight", 420, capped(180, { rule: "last", n: 2 })),
  ],
  C: [3, 4, 5].map(allUp),
  D: [windowTask("D", "Two flights", 600, capped(300, { rule: "all" }, 2))],
  E: [poker(600), poker(900)],
  F: [windowTask("F", "3 out of 6", 600, capped(180, { rule: "best", n: 3 }, 6))],
  G: [windowTask("G", "Five longest flights", 600, capped(120, { rule: "best", n: 5 }))],
  H: [
    windowTask("H", "1, 2, 3 and 4 minute target flight times, any order", 600, {
      launchLimit: null,
      counting: { rule: "best", n: 4 },
      capSec: null,
      ladder: { order: "any-order", targetsSec: [60, 120, 180, 240] },
    }),
  ],
  I: [windowTask("I", "Three longest flights", 600, capped(200, { rule: "best", n: 3 }))],
  J: [windowTask("J", "Three last flights", 600, capped(180, { rule: "last", n: 3 }))],
  K: [
    windowTask("K", "Big ladder", 600, {
      launchLimit: 5,
      counting: { rule: "all" },
      capSec: null,
      ladder: { order: "in-order", targetsSec: [60, 90, 120, 150, 180] },
    }),
  ],
  L: [
    windowTask("L", "One flight", 600, capped(599, { rule: "all" }, 1)),
    windowTask("L", "One flight", 420, capped(419, { rule: "all" }, 1)),
  ],
  M: [
    windowTask("M", "Huge ladder (fly-off only)", 900, {
      launchLimit: 3,
      counting: { rule: "all" },
      capSec: null,
      ladder: { order: "in-order", targetsSec: [180, 300, 420] },
    }),
  ],
  N: [windowTask("N", "Best flight", 600, capped(599, { rule: "best", n: 1 }))],
};

/** The working-time choices (task C: attempt counts) a letter offers. */
export function listVariants(letter: TaskLetter): number[] {
  return CATALOGUE[letter].map((d) => (d.kind === "all-up" ? d.attempts : d.workingTimeSec));
}

/**
 * Looks up a catalogue task. `variant` is the working time in seconds (task C: the number
 * of attempts); omitted → the default (10 minutes; 15 for M; 3 attempts for C).
 * Throws a plain Error naming the valid choices when the variant does not exist.
 */
export function getCatalogueTask(letter: TaskLetter, variant?: number): TaskDefinition {
  return structuredClone(findCatalogueTask(letter, variant));
}

/** Like getCatalogueTask but returns the shared entry itself (read it, never change it). */
export function findCatalogueTask(letter: TaskLetter, variant?: number): TaskDefinition {
  const variants = CATALOGUE[letter];
  if (!variants) throw new Error(`Unknown task letter "${String(letter)}".`);
  const found = variant === undefined ? variants[0] : variants.find((d) => (d.kind === "all-up" ? d.attempts : d.workingTimeSec) === variant);
  if (!found) {
    throw new Error(`Task ${letter} has no variant ${variant}; choose one of ${listVariants(letter).join(", ")}.`);
  }
  return found;
}

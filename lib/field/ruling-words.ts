import type { PenaltyCause, ReflightCause, ReflightPlacement } from "@/lib/events/schema";

/** Plain words for penalty causes, with the points the rules set (RULES.md "Penalties"). */
export const PENALTY_CAUSE_WORDS: Record<PenaltyCause, { label: string; points: number | null; rule: string }> = {
  "object-in-safety-area": { label: "Model touched an object or the ground in a safety area", points: 100, rule: "F3K.4.3" },
  "person-in-safety-area": { label: "Model touched a person in a safety area", points: 300, rule: "F3K.4.3" },
  "person-outside-safety-area": { label: "Model touched a person outside a safety area", points: 100, rule: "F3K.4.3" },
  "outside-time": { label: "Launched or flew outside the group's times", points: 100, rule: "F3K.9.5" },
  "relaunch-outside-field": { label: "Relaunched outside the field while retrieving", points: 100, rule: "F3K.2.4" },
  "launch-contact": { label: "Contact with a person at launch (the round scores zero)", points: null, rule: "F3K.4.1" },
  other: { label: "Something else", points: null, rule: "" },
};

export const REFLIGHT_CAUSE_WORDS: Record<ReflightCause, string> = {
  organiser: "the organiser's fault",
  "launch-collision": "a collision during the launch",
  "outsider-moved-model": "someone else moved the model",
  rain: "rain",
};

/** Where the re-flight is flown and which result then stands (lib/scoring/reflight.ts). */
export const REFLIGHT_PLACEMENT_WORDS: Record<ReflightPlacement, { label: string; stands: string }> = {
  "later-group": { label: "in a later group", stands: "the better of the two results stands" },
  "new-group": { label: "in a new group of re-flyers", stands: "the re-flight's result stands, even if worse" },
  "original-group": { label: "with the original group at the end of the round", stands: "the re-flight's result stands, even if worse" },
};

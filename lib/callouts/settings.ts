import { z } from "zod";
import type { Callout, CalloutGroup } from "./types";

/** The user's callout choices, kept on the device. */
export const calloutSettingsSchema = z.object({
  muted: z.boolean(),
  /** Spoken words, or distinct tones (also the fallback when no voice works offline). */
  output: z.enum(["voice", "tones"]),
  vibrate: z.boolean(),
  /** The chosen voice's `voiceURI` among the device's local voices, or null for the default. */
  voiceURI: z.string().max(500).nullable(),
  groups: z.object({
    minutes: z.boolean(),
    lastSeconds: z.boolean(),
    targets: z.boolean(),
    landingWindow: z.boolean(),
    preparation: z.boolean(),
  }),
});
export type CalloutSettings = z.infer<typeof calloutSettingsSchema>;

export const DEFAULT_CALLOUT_SETTINGS: CalloutSettings = {
  muted: false,
  output: "voice",
  vibrate: true,
  voiceURI: null,
  groups: { minutes: true, lastSeconds: true, targets: true, landingWindow: true, preparation: true },
};

/** Reads stored settings; an unreadable field falls back to its default, the others are kept. */
export function parseCalloutSettings(raw: unknown): CalloutSettings {
  const whole = calloutSettingsSchema.safeParse(raw);
  if (whole.success) return whole.data;
  if (typeof raw !== "object" || raw === null) return DEFAULT_CALLOUT_SETTINGS;
  const r = raw as Record<string, unknown>;
  const shape = calloutSettingsSchema.shape;
  const field = <K extends keyof CalloutSettings>(key: K): CalloutSettings[K] => {
    const parsed = shape[key].safeParse(r[key]);
    return parsed.success ? (parsed.data as CalloutSettings[K]) : DEFAULT_CALLOUT_SETTINGS[key];
  };
  const g = (typeof r.groups === "object" && r.groups !== null ? r.groups : {}) as Record<string, unknown>;
  const groups = { ...DEFAULT_CALLOUT_SETTINGS.groups };
  for (const key of Object.keys(groups) as (keyof typeof groups)[]) {
    if (typeof g[key] === "boolean") groups[key] = g[key];
  }
  return { muted: field("muted"), output: field("output"), vibrate: field("vibrate"), voiceURI: field("voiceURI"), groups };
}

/** The callouts the user wants (none when muted). */
export function selectCallouts(callouts: readonly Callout[], settings: CalloutSettings): Callout[] {
  if (settings.muted) return [];
  return callouts.filter((c) => settings.groups[c.group as CalloutGroup]);
}

import { describe, expect, it } from "vitest";
import { DEFAULT_CALLOUT_SETTINGS, freshCallouts, parseCalloutSettings, pickVoice, selectCallouts, type Callout } from "@/lib/callouts";

const c = (id: string, atMs: number, group: Callout["group"]): Callout => ({ id, atMs, text: id, tone: "tick", group, lane: null });

describe("callout settings", () => {
  it("mute says nothing; switched-off groups are left out", () => {
    const all = [c("a", 1, "minutes"), c("b", 2, "targets"), c("d", 3, "landingWindow")];
    expect(selectCallouts(all, { ...DEFAULT_CALLOUT_SETTINGS, muted: true })).toEqual([]);
    const noTargets = { ...DEFAULT_CALLOUT_SETTINGS, groups: { ...DEFAULT_CALLOUT_SETTINGS.groups, targets: false } };
    expect(selectCallouts(all, noTargets).map((x) => x.id)).toEqual(["a", "d"]);
  });

  it("reads stored settings, keeping good fields and defaulting the rest", () => {
    expect(parseCalloutSettings(null)).toEqual(DEFAULT_CALLOUT_SETTINGS);
    expect(parseCalloutSettings("junk")).toEqual(DEFAULT_CALLOUT_SETTINGS);
    const partial = parseCalloutSettings({ output: "tones", groups: { minutes: false } });
    expect(partial.output).toBe("tones");
    expect(partial.groups).toEqual({ ...DEFAULT_CALLOUT_SETTINGS.groups, minutes: false });
    expect(parseCalloutSettings({ output: "shout", muted: true })).toEqual({ ...DEFAULT_CALLOUT_SETTINGS, muted: true });
  });

  it("drops callouts more than 1.5 s late (a hidden page coming back)", () => {
    const due = [c("old", 1_000, "lastSeconds"), c("edge", 3_500, "lastSeconds"), c("new", 4_900, "lastSeconds")];
    expect(freshCallouts(due, 5_000).map((x) => x.id)).toEqual(["edge", "new"]);
  });
});

describe("voice choice (MDN SpeechSynthesisVoice.localService: only local voices work offline)", () => {
  const v = (voiceURI: string, lang: string, localService: boolean, isDefault = false) => ({ voiceURI, name: voiceURI, lang, localService, default: isDefault });
  const voices = [v("remote-en", "en-GB", false, true), v("local-de", "de-DE", true), v("local-en", "en-US", true), v("local-en-2", "en-GB", true)];

  it("prefers the chosen local voice, else a local voice in the page's language", () => {
    expect(pickVoice(voices, "local-en-2")?.voiceURI).toBe("local-en-2");
    expect(pickVoice(voices, null)?.voiceURI).toBe("local-en");
    expect(pickVoice(voices, "remote-en")?.voiceURI).toBe("local-en"); // a remote choice is not honoured
  });

  it("returns null when no voice is local (the caller plays tones)", () => {
    expect(pickVoice([v("remote", "en", false, true)], null)).toBeNull();
    expect(pickVoice([], null)).toBeNull();
  });
});

import { describe, expect, it } from "vitest";
import { flightTimeFormSchema, penaltyFormSchema, targetFormSchema } from "@/lib/field/field-forms";

/** The field's form schemas (ours): plain words, on the field they concern. */
const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => [i.path.join("."), i.message]);

describe("the field's small forms", () => {
  const penalty = { cause: "object-in-safety-area", points: "100", launchId: "", midAir: false, reason: "" } as const;

  it("a penalty's points are a whole number from 1 to 1000", () => {
    for (const points of ["0", "1001", "1.5", "", "ten"]) {
      expect(messages(penaltyFormSchema.safeParse({ ...penalty, points }))).toEqual([["points", "Points are a whole number from 1 to 1000."]]);
    }
    expect(penaltyFormSchema.safeParse({ ...penalty, points: " 300 " }).success).toBe(true);
  });

  it("\"something else\" needs its details; a listed cause does not", () => {
    expect(messages(penaltyFormSchema.safeParse({ ...penalty, cause: "other", reason: "  " }))).toEqual([["reason", "Say what happened."]]);
    expect(penaltyFormSchema.safeParse({ ...penalty, cause: "other", reason: "Hit the tent" }).success).toBe(true);
  });

  it("a typed time is seconds or minutes:seconds", () => {
    expect(messages(flightTimeFormSchema.safeParse({ time: "1:75" }))).toEqual([["time", "Type the time as seconds (63.4) or minutes:seconds (1:03.4)."]]);
    expect(flightTimeFormSchema.safeParse({ time: "1:03.4" }).success).toBe(true);
  });

  it("a typed target is whole seconds from 1 to 3600", () => {
    expect(messages(targetFormSchema.safeParse({ target: "3601" }))).toEqual([["target", "A target is a whole number of seconds, 1 to 3600."]]);
    expect(targetFormSchema.safeParse({ target: "45" }).success).toBe(true);
  });
});

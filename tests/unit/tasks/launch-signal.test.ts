import { describe, expect, it } from "vitest";
import { CATALOGUE, flightsStartOnSignal } from "@/lib/tasks";

describe("flightsStartOnSignal", () => {
  it("holds for task C alone among the catalogue's tasks (F3K.11: only C launches each attempt at a signal)", () => {
    const onSignal = Object.values(CATALOGUE).flat().filter((d) => flightsStartOnSignal(d)).map((d) => d.letter);
    expect(new Set(onSignal)).toEqual(new Set(["C"]));
    expect(CATALOGUE.C.every((d) => flightsStartOnSignal(d))).toBe(true); // every attempt count (3–5, F3K.11.3)
  });
});

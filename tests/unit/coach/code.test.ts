import { describe, expect, it } from "vitest";
import { hashCoachCode, newCoachCode, normaliseCoachCode } from "@/lib/coach/code";

describe("one-time coach codes", () => {
  it("are two groups of four characters a coach cannot misread", () => {
    const codes = Array.from({ length: 200 }, newCoachCode);
    for (const c of codes) expect(c).toMatch(/^[A-HJKMNP-Z2-9]{4}-[A-HJKMNP-Z2-9]{4}$/);
    expect(new Set(codes).size).toBe(codes.length);
  });

  it("hash the same however the coach types them (case, spaces, hyphens), and differently when a character differs", () => {
    expect(normaliseCoachCode(" k7qm 2xpa ")).toBe("K7QM2XPA");
    expect(hashCoachCode("k7qm 2xpa")).toBe(hashCoachCode("K7QM-2XPA"));
    expect(hashCoachCode("K7QM-2XPB")).not.toBe(hashCoachCode("K7QM-2XPA"));
    expect(hashCoachCode("K7QM-2XPA")).toMatch(/^[0-9a-f]{64}$/);
  });
});

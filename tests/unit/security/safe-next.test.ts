import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/lib/security/safe-next";

describe("safeNextPath", () => {
  it("keeps a path on this site, with its query and fragment", () => {
    expect(safeNextPath("/logbook")).toBe("/logbook");
    expect(safeNextPath("/logbook/run?id=abc#flights")).toBe("/logbook/run?id=abc#flights");
    expect(safeNextPath("/")).toBe("/");
  });

  it("falls back to home for anything that could leave the site", () => {
    for (const next of [
      "//elsewhere.example",
      "//elsewhere.example/path",
      "/\\elsewhere.example",
      "\\\\elsewhere.example",
      "/\t/elsewhere.example",
      "/\n/elsewhere.example",
      "https://elsewhere.example/",
      "http:elsewhere.example",
      "javascript:alert(1)",
      "elsewhere.example",
      " //elsewhere.example",
      "",
      null,
      undefined,
    ]) {
      expect(safeNextPath(next), JSON.stringify(next)).toBe("/");
    }
  });

  it("uses the given fallback", () => {
    expect(safeNextPath("//x", "/field")).toBe("/field");
  });
});

import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

/**
 * Contrast of the colour tokens as app/globals.css defines them, computed with the WCAG 2.x
 * formulas (https://www.w3.org/TR/WCAG21/#dfn-relative-luminance and #dfn-contrast-ratio):
 * sRGB channel c/255 → c/12.92 when ≤ 0.04045, else ((c + 0.055)/1.055)^2.4;
 * L = 0.2126 R + 0.7152 G + 0.0722 B; ratio = (L1 + 0.05)/(L2 + 0.05) with L1 the lighter.
 * Thresholds: 3:1 for graphical objects (WCAG 2.1 SC 1.4.11), 7:1 for text (SC 1.4.6, AAA);
 * using AAA for the outdoor scheme is our choice (read in direct sun).
 */
type Rgb = [number, number, number];
const css = readFileSync(new URL("../../../app/globals.css", import.meta.url), "utf8");

function tokens(theme: string): Record<string, Rgb> {
  const block = css.match(new RegExp(`\\[data-theme="${theme}"\\][^{]*\\{([^}]*)\\}`))?.[1];
  if (!block) throw new Error(`no ${theme} block in globals.css`);
  return Object.fromEntries([...block.matchAll(/--([\w-]+):\s*(\d+)\s+(\d+)\s+(\d+);/g)].map((m) => [m[1]!, [Number(m[2]), Number(m[3]), Number(m[4])] as Rgb]));
}

const channel = (c: number) => {
  const s = c / 255;
  return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
};
const luminance = ([r, g, b]: Rgb) => 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b);
const ratio = (a: Rgb, b: Rgb) => {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
};

describe("the formula itself (WCAG 2.x reference values)", () => {
  it("gives 21:1 for black on white and 1:1 for a colour on itself", () => {
    expect(ratio([0, 0, 0], [255, 255, 255])).toBeCloseTo(21, 5);
    expect(ratio([118, 118, 118], [118, 118, 118])).toBe(1);
    // #767676 on white is the well-known lightest grey that passes 4.5:1 (≈ 4.54)
    expect(ratio([118, 118, 118], [255, 255, 255])).toBeCloseTo(4.54, 2);
  });
});

describe("the timeline strip's colours (issue #10: hard to tell apart in the dark scheme)", () => {
  for (const theme of ["light", "dark", "outdoor"]) {
    it(`${theme}: a flight (air) and the ground differ by at least 3:1 (SC 1.4.11)`, () => {
      const t = tokens(theme);
      expect(ratio(t.air!, t.ground!)).toBeGreaterThanOrEqual(3);
    });
  }
  it("dark: a flight that does not count (air-pale) and the ground differ by at least 3:1", () => {
    const t = tokens("dark");
    expect(t["air-pale"], "an air-pale token").toBeDefined();
    expect(ratio(t["air-pale"]!, t.ground!)).toBeGreaterThanOrEqual(3);
  });
});

describe("text in the outdoor scheme is at least 7:1 (SC 1.4.6; our choice for sunlight)", () => {
  const t = tokens("outdoor");
  for (const fg of ["ink", "muted", "accent", "warn", "danger", "good"]) {
    it(`${fg} on surface and on raised`, () => {
      expect(ratio(t[fg]!, t.surface!)).toBeGreaterThanOrEqual(7);
      expect(ratio(t[fg]!, t.raised!)).toBeGreaterThanOrEqual(7);
    });
  }
  it("accent-ink on accent (button labels)", () => {
    expect(ratio(t["accent-ink"]!, t.accent!)).toBeGreaterThanOrEqual(7);
  });
  it("the strip's scale text (ink) on the ground", () => {
    expect(ratio(t.ink!, t.ground!)).toBeGreaterThanOrEqual(7);
  });
});

import { describe, expect, it } from "vitest";
import { heightToPressureHpa, pressureToHeightM } from "@/lib/altimeter/isa";

/**
 * ICAO Standard Atmosphere, ICAO Doc 7488/3 (1993): pressure against geopotential height in
 * the troposphere. The values below were NOT read from Doc 7488 itself (it is not reachable from
 * here): they come from a table "based on the International Standard Atmosphere for dry air (ICAO
 * 1964)" published at http://www.meteowvl.be/MetInfo/StandAtmosfeer.html (heights to the metre),
 * and the sea-level and lapse-rate definitions (1013.25 hPa, 15 °C, 6.5 °C/km) that Doc 7488
 * states. Check them against the document when it is at hand.
 */
const TABLE: [hPa: number, heightM: number][] = [
  [1013.25, 0],
  [1000, 111],
  [950, 540],
  [900, 988],
  [850, 1457],
  [800, 1949],
  [700, 3012],
  [600, 4206],
];

describe("ICAO standard atmosphere (Doc 7488/3)", () => {
  it.each(TABLE)("%s hPa is %s m within 1 m (the table rounds to the metre)", (hPa, heightM) => {
    expect(Math.abs(pressureToHeightM(hPa) - heightM)).toBeLessThanOrEqual(1);
  });

  it("the conversion runs both ways", () => {
    for (const h of [-300, 0, 75, 1500, 8000]) expect(pressureToHeightM(heightToPressureHpa(h))).toBeCloseTo(h, 6);
  });

  it("near the ground 1 hPa is about 8.3 m, so a launch of 60 m is about 7 hPa", () => {
    expect(pressureToHeightM(1012.25) - pressureToHeightM(1013.25)).toBeCloseTo(8.32, 1);
  });
});

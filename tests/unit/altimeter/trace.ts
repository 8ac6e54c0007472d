import { mulberry32 } from "@/lib/random";
import type { Sample } from "@/lib/altimeter/series";

/** A launch as the generator flies it: leaves the hand at atMs, climbs for climbS to heightM. */
export type KnownLaunch = { atMs: number; heightM: number; climbS: number; sinkMs: number };

/**
 * An altimeter trace with known launches: on the ground (at groundM, holding still) between
 * flights; each flight a ballistic zoom (climb rate falling linearly to zero at the peak), then a
 * glide sinking at sinkMs with a gentle bump of lift, down to the ground. Gaussian noise σ
 * (Box–Muller on the seeded PRNG) and 0.1 m resolution, sampled at hz.
 */
export function generateTrace(options: { seed: number; hz: number; noiseM: number; launches: number; groundM?: number }): { samples: Sample[]; launches: KnownLaunch[] } {
  const rnd = mulberry32(options.seed);
  const ground = options.groundM ?? 0;
  const launches: KnownLaunch[] = [];
  const flights: { start: number; end: number; height: (ms: number) => number }[] = [];
  let t = 1_700_000_000_000 + Math.round(rnd() * 1000);
  t += 8000 + rnd() * 10_000;
  for (let k = 0; k < options.launches; k++) {
    const heightM = 15 + rnd() * 75;
    const climbS = 2.5 + rnd() * 1.5;
    const sinkMs = 0.3 + rnd() * 0.3;
    const atMs = Math.round(t);
    const peakMs = atMs + climbS * 1000;
    const bump = 2 + rnd() * 3;
    const glideS = heightM / sinkMs;
    launches.push({ atMs, heightM, climbS, sinkMs });
    flights.push({
      start: atMs,
      end: peakMs + glideS * 1000,
      height: (ms) => {
        if (ms <= peakMs) return heightM * (1 - ((peakMs - ms) / (climbS * 1000)) ** 2);
        const s = (ms - peakMs) / 1000;
        const lift = s > 10 && s < glideS - 10 ? bump * Math.sin((Math.PI * (s - 10)) / (glideS - 20)) : 0;
        return Math.max(0, heightM - sinkMs * s + lift);
      },
    });
    t = peakMs + glideS * 1000 + 5000 + rnd() * 25_000;
  }
  const samples: Sample[] = [];
  const step = 1000 / options.hz;
  const first = 1_700_000_000_000 + rnd() * step;
  for (let ms = first; ms < t; ms += step) {
    const f = flights.find((x) => ms >= x.start && ms < x.end);
    const noise = options.noiseM * Math.sqrt(-2 * Math.log(1 - rnd())) * Math.cos(2 * Math.PI * rnd());
    samples.push({ tMs: Math.round(ms), hM: Math.round((ground + (f ? f.height(ms) : 0) + noise) * 10) / 10 });
  }
  return { samples, launches };
}

/** One altimeter sample: time (ms, on whatever clock the log uses) and height (m). */
export type Sample = { tMs: number; hM: number };

/** Each value replaced by the median of the `width` values centred on it (ends: what exists). */
export function movingMedian(values: readonly number[], width: number): number[] {
  const half = Math.floor(Math.max(1, width) / 2);
  if (half === 0) return [...values];
  return values.map((_, i) => {
    const w = values.slice(Math.max(0, i - half), i + half + 1).sort((a, b) => a - b);
    return w[Math.floor(w.length / 2)]!;
  });
}

export type Line = { slope: number; at: (tMs: number) => number; timeAt: (value: number) => number };

/** The least-squares straight line value = a + slope·t through the samples (at least two). */
export function fitLine(points: readonly Sample[]): Line {
  const n = points.length;
  const t0 = points[0]!.tMs; // centred for precision with epoch-sized times
  let st = 0, sh = 0, stt = 0, sth = 0;
  for (const p of points) {
    const x = p.tMs - t0;
    st += x;
    sh += p.hM;
    stt += x * x;
    sth += x * p.hM;
  }
  const denom = n * stt - st * st;
  const slope = denom === 0 ? 0 : (n * sth - st * sh) / denom;
  const a = (sh - slope * st) / n;
  return { slope, at: (tMs) => a + slope * (tMs - t0), timeAt: (value) => t0 + (value - a) / slope };
}

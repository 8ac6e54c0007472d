import { mulberry32 } from "../random";
import { groupSizes } from "./groups";
import type { Draw } from "./meetings";

/** Fisher–Yates shuffle with the given source of randomness (a new array). */
export function shuffle<T>(items: readonly T[], random: () => number): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}

/** The yardstick: each round a fresh shuffle cut into the same group sizes, nothing more. */
export function randomDraw(p: { pilots: number; rounds: number; maxGroupSize: number; seed: number }): Draw {
  const random = mulberry32(p.seed);
  const sizes = groupSizes(p.pilots, p.maxGroupSize);
  const all = Array.from({ length: p.pilots }, (_, i) => i);
  return Array.from({ length: p.rounds }, () => {
    const order = shuffle(all, random);
    let at = 0;
    return sizes.map((s) => order.slice(at, (at += s)));
  });
}

/**
 * The most a set of slots (maxima in tenths) can still hold, given flights already flown,
 * the flight in the air, the launches left and the time left. Assumes an instant relaunch,
 * so it is an upper bound ("best still possible"), never a promise.
 */
export type FillInput = {
  caps: readonly number[];
  /** Values (tenths) of landed flights that may fill slots. */
  fixed: readonly number[];
  /** Every fixed value must take a slot (last-n counting) or only the useful ones (best-n). */
  mustUseFixed: boolean;
  /** Current time (tenths) of the flight in the air, if it can still count. */
  open: number | null;
  /** New launches still allowed. */
  launchesLeft: number;
  /** Time left to fly, in tenths. */
  timeLeft: number;
  /** The F3K.7 cap for k scored flights, or null. */
  sumCap: (scored: number) => number | null;
};

/** Best total over every way of placing fixed, open and new flights into the slots. */
export function bestFill(input: FillInput): number {
  const n = input.caps.length;
  const fixed = [...input.fixed].sort((a, b) => b - a);
  const uniform = input.caps.every((c) => c === input.caps[0]);
  let best = 0;
  const consider = (fixedSlots: number[]) => {
    const k = fixedSlots.length;
    if (k > fixed.length || (input.mustUseFixed && k !== Math.min(fixed.length, n))) return;
    const sortedFixedSlots = fixedSlots.map((i) => input.caps[i]!).sort((a, b) => b - a);
    let base = 0;
    let scored = 0;
    for (let i = 0; i < k; i++) {
      const v = Math.min(fixed[i]!, sortedFixedSlots[i]!);
      base += v;
      if (v > 0) scored++;
    }
    const free = input.caps.filter((_, i) => !fixedSlots.includes(i)).sort((a, b) => b - a);
    const openChoices: (number | null)[] = input.open === null ? [null] : [null, ...free.keys()];
    for (const openSlot of openChoices) {
      let fill = base;
      let count = scored;
      let room = 0;
      const rest = [...free];
      if (openSlot !== null && input.open !== null) {
        const cap = rest.splice(openSlot, 1)[0]!;
        fill += Math.min(input.open, cap);
        room += Math.max(0, cap - input.open);
        count += 1;
      }
      for (let m = 0; m <= Math.min(rest.length, input.launchesLeft); m++) {
        if (m > 0) room += rest[m - 1]!;
        const gain = Math.min(input.timeLeft, room);
        const total = fill + gain;
        const cap = input.sumCap(count + m);
        const value = cap === null ? total : Math.min(total, cap);
        if (value > best) best = value;
      }
    }
  };
  if (uniform || n > 12) {
    for (let k = 0; k <= Math.min(n, fixed.length); k++) consider(Array.from({ length: k }, (_, i) => i));
  } else {
    for (let mask = 0; mask < 1 << n; mask++) {
      const slots: number[] = [];
      for (let i = 0; i < n; i++) if (mask & (1 << i)) slots.push(i);
      consider(slots);
    }
  }
  return best;
}

/**
 * A round's URL segment and name: preliminary rounds by number ("3", "Round 3"), fly-off rounds
 * with their own numbering ("fly-off-2", "Fly-off round 2"), as `contest_rounds` keeps them apart.
 */
export type RoundRef = { number: number; flyOff: boolean };

export const roundKey = (r: RoundRef): string => (r.flyOff ? `fly-off-${r.number}` : String(r.number));
export const roundName = (r: RoundRef): string => (r.flyOff ? `Fly-off round ${r.number}` : `Round ${r.number}`);

/** "3" → round 3; "fly-off-2" → fly-off round 2; null when the segment names no round. */
export function parseRoundKey(key: string): RoundRef | null {
  const m = /^(fly-off-)?([1-9]\d?)$/.exec(key);
  return m ? { number: Number(m[2]), flyOff: m[1] !== undefined } : null;
}

/**
 * How a round's pilots split into groups (F3K.9.1): as few groups as possible, at least 5 pilots
 * in each, sizes differing by at most one. `maxSize` is the officer's largest group (lanes and
 * timekeepers at hand). When the two cannot both hold (e.g. 11 pilots, at most 5 a group), the
 * rule's minimum of 5 wins and groups grow past `maxSize`; fewer than 5 pilots make one group.
 */
export const MIN_GROUP = 5;

export function groupSizes(pilots: number, maxSize: number): number[] {
  if (pilots <= 0) return [];
  let groups = Math.max(1, Math.ceil(pilots / Math.max(1, maxSize)));
  if (Math.floor(pilots / groups) < MIN_GROUP) groups = Math.max(1, Math.floor(pilots / MIN_GROUP));
  const base = Math.floor(pilots / groups);
  const bigger = pilots % groups;
  return Array.from({ length: groups }, (_, i) => base + (i < bigger ? 1 : 0));
}

/** Each round a pilot meets g − 1 others; over R rounds someone meets a rival ⌈R(g − 1)/(N − 1)⌉ times at least. */
export function meetingLowerBound(pilots: number, rounds: number, sizes: number[]): number {
  if (pilots < 2 || sizes.length === 0) return 0;
  const largest = Math.max(...sizes);
  return Math.ceil((rounds * (largest - 1)) / (pilots - 1));
}

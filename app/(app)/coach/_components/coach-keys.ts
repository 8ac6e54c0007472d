/** The coach desk's query keys: in a plain module, so the server page prefetches under the same keys the client reads. */
export const coachKeys = {
  grants: ["coach-grants"] as const,
  roster: ["coach-roster"] as const,
  plans: ["coach-plans"] as const,
};

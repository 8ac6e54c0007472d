/** Roles inside a club and who may change them (pure: the server and the club page share it). */
export type ClubRole = "member" | "coach" | "officer";

export const ROLE_RANK: Record<ClubRole, number> = { member: 0, coach: 1, officer: 2 };

export const ROLE_LABEL: Record<ClubRole, string> = { member: "Member", coach: "Coach", officer: "Officer" };

/** Whether `role` is at least `needed` (officers pass coach and member checks). */
export function hasClubRole(role: ClubRole | null, needed: ClubRole): boolean {
  return role !== null && ROLE_RANK[role] >= ROLE_RANK[needed];
}

/**
 * What a change to one membership leaves: a club must keep at least one officer, so the last
 * officer can neither leave, be removed nor step down (another officer is named first).
 */
export function leavesAnOfficer(officers: number, target: ClubRole, next: ClubRole | null): boolean {
  if (target !== "officer" || next === "officer") return true;
  return officers > 1;
}

/**
 * What an admin's change to an account means, decided without the database (db/queries/admin-users.ts
 * applies it under a lock, with its audit entry, in one transaction).
 */

export type SiteRole = "member" | "admin";
export type UserChange = { action: "disable" } | { action: "enable" } | { action: "set-role"; role: SiteRole };
export type AccountStanding = { role: SiteRole; disabled: boolean };
export type AuditAction = "user.disable" | "user.enable" | "user.role";

export type ChangePlan =
  | { kind: "unchanged" }
  | {
      kind: "change";
      next: AccountStanding;
      /**
       * Start a new session generation: disabling signs every session out for good, so re-enabling
       * later brings none of them back (the user signs in again).
       */
      endSessions: boolean;
      /** The change takes an active admin away: refused when no other active admin would remain. */
      removesActiveAdmin: boolean;
      audit: { action: AuditAction; detail: { fromRole?: SiteRole; toRole?: SiteRole } };
    };

const isActiveAdmin = (a: AccountStanding) => a.role === "admin" && !a.disabled;

/** The plan for `change` on an account standing as `now`; "unchanged" when it already stands so. */
export function planUserChange(now: AccountStanding, change: UserChange): ChangePlan {
  let next: AccountStanding;
  let audit: Extract<ChangePlan, { kind: "change" }>["audit"];
  if (change.action === "disable") {
    if (now.disabled) return { kind: "unchanged" };
    next = { ...now, disabled: true };
    audit = { action: "user.disable", detail: {} };
  } else if (change.action === "enable") {
    if (!now.disabled) return { kind: "unchanged" };
    next = { ...now, disabled: false };
    audit = { action: "user.enable", detail: {} };
  } else {
    if (now.role === change.role) return { kind: "unchanged" };
    next = { ...now, role: change.role };
    audit = { action: "user.role", detail: { fromRole: now.role, toRole: change.role } };
  }
  return {
    kind: "change",
    next,
    endSessions: change.action === "disable",
    removesActiveAdmin: isActiveAdmin(now) && !isActiveAdmin(next),
    audit,
  };
}

import { describe, expect, it } from "vitest";
import { planUserChange, type AccountStanding } from "@/lib/admin/user-change";

const member: AccountStanding = { role: "member", disabled: false };
const admin: AccountStanding = { role: "admin", disabled: false };

describe("planUserChange", () => {
  it("disabling an active member ends their sessions and takes no admin away", () => {
    expect(planUserChange(member, { action: "disable" })).toEqual({
      kind: "change", next: { role: "member", disabled: true }, endSessions: true, removesActiveAdmin: false,
      audit: { action: "user.disable", detail: {} },
    });
  });

  it("disabling or demoting an active admin takes an admin away", () => {
    expect(planUserChange(admin, { action: "disable" })).toMatchObject({ kind: "change", removesActiveAdmin: true });
    expect(planUserChange(admin, { action: "set-role", role: "member" })).toMatchObject({
      kind: "change", next: { role: "member", disabled: false }, endSessions: false, removesActiveAdmin: true,
      audit: { action: "user.role", detail: { fromRole: "admin", toRole: "member" } },
    });
  });

  it("re-enabling starts no new session generation (disabling did) and gives an admin back", () => {
    expect(planUserChange({ role: "admin", disabled: true }, { action: "enable" })).toEqual({
      kind: "change", next: { role: "admin", disabled: false }, endSessions: false, removesActiveAdmin: false,
      audit: { action: "user.enable", detail: {} },
    });
  });

  it("demoting a disabled admin takes no active admin away", () => {
    expect(planUserChange({ role: "admin", disabled: true }, { action: "set-role", role: "member" })).toMatchObject({ removesActiveAdmin: false });
  });

  it("a change to how the account already stands is unchanged (and so not audited)", () => {
    expect(planUserChange({ role: "member", disabled: true }, { action: "disable" })).toEqual({ kind: "unchanged" });
    expect(planUserChange(member, { action: "enable" })).toEqual({ kind: "unchanged" });
    expect(planUserChange(admin, { action: "set-role", role: "admin" })).toEqual({ kind: "unchanged" });
  });
});

import { describe, expect, it } from "vitest";
import { describeAdminAction } from "@/lib/admin/audit-text";

const base = { detail: {}, targetEmail: "tobi@example.com", targetMailTo: null };

describe("describeAdminAction", () => {
  it("says what was done to whom", () => {
    expect(describeAdminAction({ ...base, action: "user.disable" })).toBe("disabled tobi@example.com");
    expect(describeAdminAction({ ...base, action: "user.enable" })).toBe("re-enabled tobi@example.com");
    expect(describeAdminAction({ ...base, action: "user.role", detail: { fromRole: "member", toRole: "admin" } })).toBe(
      "changed the site role of tobi@example.com from member to admin",
    );
  });

  it("names the addressee of a retried message and its attempts, or a removed record", () => {
    expect(describeAdminAction({ ...base, action: "mail.retry", targetMailTo: "ada@example.com", detail: { attempts: 1 } })).toBe(
      "sent the e-mail to ada@example.com again (after 1 attempt)",
    );
    expect(describeAdminAction({ action: "mail.retry", detail: {}, targetEmail: null, targetMailTo: null })).toBe("sent the e-mail to a removed record again");
  });
});

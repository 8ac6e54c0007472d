import { describe, expect, it } from "vitest";
import { clubInvitationMail } from "@/lib/mail/messages";

describe("club invitation mail", () => {
  it("names the club, the inviter and the role, carries the link in both bodies and escapes typed names", () => {
    const m = clubInvitationMail({ clubName: "<b>Kite & Co</b>", inviterName: "Ines", roleLabel: "Coach", link: "http://localhost:3000/join-club?token=abc", days: 7 });
    expect(m.kind).toBe("club-invitation");
    expect(m.subject).toBe("Join <b>Kite & Co</b> — Windowcall");
    expect(m.text).toContain("Ines invites you to join <b>Kite & Co</b> on Windowcall as coach.");
    expect(m.text).toContain("http://localhost:3000/join-club?token=abc");
    expect(m.text).toContain("for 7 days");
    expect(m.html).toContain("&lt;b&gt;Kite &amp; Co&lt;/b&gt;");
    expect(m.html).not.toContain("<b>Kite");
    expect(m.html).toContain('href="http://localhost:3000/join-club?token=abc"');
  });
});

import { describe, expect, it } from "vitest";
import { compose } from "@/lib/mail/layout";
import { resetPasswordMail, signUpAttemptMail, verifyEmailMail } from "@/lib/mail/messages";
import { retryDelayMs, MAX_MAIL_ATTEMPTS } from "@/lib/mail/backoff";

describe("mail messages", () => {
  it("carry the app's name and the link in both bodies", () => {
    const m = resetPasswordMail({ link: "http://localhost:3000/reset-password?token=abc", minutes: 45 });
    expect(m.subject).toBe("Reset your password — Windowcall");
    expect(m.text).toContain("http://localhost:3000/reset-password?token=abc");
    expect(m.text).toContain("45 minutes");
    expect(m.html).toContain(">Windowcall<");
    expect(m.html).toContain('href="http://localhost:3000/reset-password?token=abc"');
  });

  it("escape what a user typed in the HTML body", () => {
    const m = verifyEmailMail({ name: '<img src=x onerror="alert(1)">', link: "http://localhost/v?token=a&b=1" });
    expect(m.html).not.toContain("<img");
    expect(m.html).toContain("&lt;img");
    expect(m.html).toContain('href="http://localhost/v?token=a&amp;b=1"');
    expect(m.text).toContain('<img src=x onerror="alert(1)">'); // plain text is shown as text
  });

  it("transactional messages have no unsubscribe line; others must carry one in both bodies", () => {
    for (const m of [verifyEmailMail({ name: "A", link: "http://x/" }), signUpAttemptMail({ resetLink: "http://x/" })]) {
      expect(m.text).not.toMatch(/unsubscribe|stop these e-mails/i);
      expect(m.html).not.toMatch(/unsubscribe/i);
    }
    const digest = compose("day-summary", "Your field day", ["Three pilots flew."], { unsubscribe: "http://x/unsubscribe?t=1" });
    expect(digest.text).toContain("To stop these e-mails, open http://x/unsubscribe?t=1");
    expect(digest.html).toContain('<a href="http://x/unsubscribe?t=1">Unsubscribe</a>');
  });
});

describe("mail retry backoff", () => {
  it("waits one minute after the first failure, doubles, caps at six hours, then gives up", () => {
    expect(retryDelayMs(1)).toBe(60_000);
    expect(retryDelayMs(2)).toBe(120_000);
    expect(retryDelayMs(9)).toBe(256 * 60_000);
    expect(retryDelayMs(10)).toBe(6 * 3600_000);
    expect(retryDelayMs(MAX_MAIL_ATTEMPTS)).toBeNull();
  });
});

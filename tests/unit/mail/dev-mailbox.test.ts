import { describe, expect, it } from "vitest";
import { devMailboxUrl, splitLinks } from "@/lib/mail/dev-mailbox";

describe("dev mailbox", () => {
  it("exists only for a loopback mailbox address", () => {
    expect(devMailboxUrl({})).toBeNull();
    expect(devMailboxUrl({ DEV_MAILBOX_URL: "http://127.0.0.1:8025" })).toBe("http://127.0.0.1:8025");
    expect(devMailboxUrl({ DEV_MAILBOX_URL: "http://localhost:8025/" })).toBe("http://localhost:8025");
    expect(devMailboxUrl({ DEV_MAILBOX_URL: "http://mail.example.com:8025" })).toBeNull();
    expect(devMailboxUrl({ DEV_MAILBOX_URL: "not a url" })).toBeNull();
  });

  it("splits text into plain parts and links", () => {
    expect(splitLinks("Open:\nhttp://localhost:3000/reset-password?token=ab_c-1\n\n— Windowcall")).toEqual([
      { text: "Open:\n" },
      { text: "http://localhost:3000/reset-password?token=ab_c-1", href: "http://localhost:3000/reset-password?token=ab_c-1" },
      { text: "\n\n— Windowcall" },
    ]);
    expect(splitLinks("no links")).toEqual([{ text: "no links" }]);
  });
});

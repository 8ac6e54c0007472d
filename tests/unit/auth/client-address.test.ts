import { describe, expect, it } from "vitest";
import { clientAddress } from "@/lib/auth/client-address";

describe("clientAddress", () => {
  const xff = (value: string) => ({ "x-forwarded-for": value });

  it("sees no address without TRUST_PROXY, whatever X-Forwarded-For says", () => {
    expect(clientAddress(xff("198.51.100.7"), undefined)).toBeNull();
    expect(clientAddress(xff("198.51.100.7"), "")).toBeNull();
    expect(clientAddress(xff("198.51.100.7"), "yes")).toBeNull();
    expect(clientAddress(xff("198.51.100.7"), "0")).toBeNull();
  });

  it("takes the entry that many hops from the right, ignoring what the client wrote in front", () => {
    expect(clientAddress(xff("6.6.6.6, 198.51.100.7"), "1")).toBe("198.51.100.7");
    expect(clientAddress(xff("6.6.6.6, 198.51.100.7, 10.0.0.2"), "2")).toBe("198.51.100.7");
    expect(clientAddress(xff("198.51.100.7"), "3")).toBe("198.51.100.7");
  });

  it("spells one address one way and has none without the header", () => {
    expect(clientAddress(xff("::ffff:192.0.2.1"), "1")).toBe("192.0.2.1");
    expect(clientAddress(xff("2001:DB8::1"), "1")).toBe("2001:db8::1");
    expect(clientAddress({}, "1")).toBeNull();
    expect(clientAddress(xff(" , "), "1")).toBeNull();
  });
});

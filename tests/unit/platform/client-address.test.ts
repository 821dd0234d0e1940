import { describe, expect, it } from "vitest";
import { clientAddress, trustedProxyList } from "@/lib/server/client-address";

// Which address the sign-in rate limit keys on (scripts/serve-app.ts). Addresses are from the
// documentation ranges of RFC 5737 (IPv4) and RFC 3849 (IPv6).

describe("clientAddress", () => {
  const none = trustedProxyList([]);

  it("uses the connection's own address and ignores a client-written X-Forwarded-For when no proxy is trusted", () => {
    expect(clientAddress("203.0.113.7", "198.51.100.1", none)).toBe("203.0.113.7");
    expect(clientAddress("203.0.113.7", undefined, none)).toBe("203.0.113.7");
  });

  it("reports IPv4-mapped IPv6 peers as plain IPv4", () => {
    expect(clientAddress("::ffff:203.0.113.7", undefined, none)).toBe("203.0.113.7");
  });

  it("believes a trusted proxy's forwarded address, taking the hop nearest to it", () => {
    const proxy = trustedProxyList(["127.0.0.1"]);
    expect(clientAddress("127.0.0.1", "198.51.100.9", proxy)).toBe("198.51.100.9");
    // A client-written entry on the left is never believed: the proxy appended the real one last.
    expect(clientAddress("127.0.0.1", "192.0.2.66, 198.51.100.9", proxy)).toBe("198.51.100.9");
  });

  it("skips a chain of trusted proxies given as a CIDR range", () => {
    const proxies = trustedProxyList(["10.0.0.0/24", "2001:db8::/32"]);
    expect(clientAddress("10.0.0.5", "198.51.100.9, 10.0.0.4", proxies)).toBe("198.51.100.9");
    expect(clientAddress("2001:db8::1", "203.0.113.8", proxies)).toBe("203.0.113.8");
    // The peer itself is not a proxy here, so the header is ignored.
    expect(clientAddress("192.0.2.1", "198.51.100.9", proxies)).toBe("192.0.2.1");
  });

  it("ignores entries that are not addresses", () => {
    const proxy = trustedProxyList(["127.0.0.1"]);
    expect(clientAddress("127.0.0.1", "unknown, 198.51.100.9", proxy)).toBe("198.51.100.9");
    expect(clientAddress("127.0.0.1", "garbage", proxy)).toBe("127.0.0.1");
  });

  it("refuses a TRUSTED_PROXIES entry that is not an address or range", () => {
    expect(() => trustedProxyList(["proxy.example"])).toThrow(/proxy\.example/);
  });
});

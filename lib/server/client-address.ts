import { BlockList, isIP } from "node:net";

// Which address a request really comes from. Used by the app server (scripts/serve-app.ts) before Next or
// better-auth see the request, because both read the client address from X-Forwarded-For, a header any
// client can write.

/** The `::ffff:a.b.c.d` form Node reports for IPv4 peers on a dual-stack socket, as plain IPv4. */
function plainAddress(address: string): string {
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(address);
  return mapped ? mapped[1] : address;
}

/**
 * Builds the set of trusted reverse proxies.
 * @param entries - addresses (`192.0.2.10`, `::1`) or CIDR ranges (`10.0.0.0/24`, `2001:db8::/48`)
 * @throws Error naming an entry that is neither
 */
export function trustedProxyList(entries: readonly string[]): BlockList {
  const list = new BlockList();
  for (const entry of entries) {
    const [address, prefix] = entry.split("/");
    const family = isIP(address);
    if (family === 0) throw new Error(`TRUSTED_PROXIES: not an IP address or range: ${entry}`);
    const type = family === 4 ? "ipv4" : "ipv6";
    if (prefix === undefined) list.addAddress(address, type);
    else list.addSubnet(address, Number(prefix), type);
  }
  return list;
}

function isTrusted(list: BlockList, address: string): boolean {
  const family = isIP(address);
  return family !== 0 && list.check(address, family === 4 ? "ipv4" : "ipv6");
}

/**
 * The client's address: the connection's own peer unless that peer is a trusted proxy, in which case the
 * X-Forwarded-For chain is walked from the right (the hop nearest to us), skipping trusted proxies, and the
 * first untrusted address is the client. Anything a client wrote further left is never believed.
 * @param peer - the socket's remote address
 * @param forwardedFor - the X-Forwarded-For header as received (absent: undefined)
 * @param trusted - from trustedProxyList; empty means no forwarding header is believed
 */
export function clientAddress(peer: string, forwardedFor: string | undefined, trusted: BlockList): string {
  let client = plainAddress(peer);
  if (!forwardedFor || !isTrusted(trusted, client)) return client;
  const hops = forwardedFor.split(",").map((hop) => plainAddress(hop.trim())).filter((hop) => isIP(hop) !== 0);
  for (let i = hops.length - 1; i >= 0; i--) {
    client = hops[i];
    if (!isTrusted(trusted, client)) break;
  }
  return client;
}

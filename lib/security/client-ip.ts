/**
 * Who the client is, for rate limits: the TCP peer, unless that peer is a reverse proxy configured
 * in TRUSTED_PROXIES — only then is its X-Forwarded-For believed, walked from the right past the
 * trusted hops (the left-most entries are whatever the client wrote). OWASP ASVS 4.0.3 V2.2.1
 * (anti-automation that an attacker cannot sidestep) and the OWASP Authentication Cheat Sheet.
 *
 * How the peer is known: Next.js fills in X-Forwarded-For from the socket only when a request has
 * none (`??=` in its base server). proxy.ts therefore moves any incoming X-Forwarded-For aside to
 * FORWARDED_CHAIN_HEADER and deletes it, so the header a route sees is the peer's address alone.
 */

/** Where proxy.ts keeps the X-Forwarded-For the request arrived with. */
export const FORWARDED_CHAIN_HEADER = "x-riseline-forwarded-chain";
/** The resolved client address handed to better-auth (its `ipAddressHeaders`). */
export const CLIENT_IP_HEADER = "x-riseline-client-ip";

/** Headers a client may not set for itself: proxy.ts removes them from every request. */
export const INTERNAL_HEADERS = [FORWARDED_CHAIN_HEADER, CLIENT_IP_HEADER] as const;

function ipv4Bytes(ip: string): number[] | null {
  const m = /^(\d{1,3})\.(\d{1,3})\.(\d{1,3})\.(\d{1,3})$/.exec(ip);
  if (!m) return null;
  const b = m.slice(1).map(Number);
  return b.every((x) => x <= 255) ? b : null;
}

function ipv6Bytes(ip: string): number[] | null {
  if (!ip.includes(":") || !/^[0-9a-f:.]+$/i.test(ip)) return null;
  const [head, tail] = ip.split("::");
  if (ip.split("::").length > 2) return null;
  const parse = (s: string) => (s ? s.split(":") : []);
  let left = parse(head);
  let right = tail === undefined ? [] : parse(tail);
  const v4 = (right.length ? right : left).at(-1);
  let v4Groups: string[] = [];
  if (v4 && v4.includes(".")) {
    const b = ipv4Bytes(v4);
    if (!b) return null;
    v4Groups = [((b[0] << 8) | b[1]).toString(16), ((b[2] << 8) | b[3]).toString(16)];
    if (right.length) right = [...right.slice(0, -1), ...v4Groups];
    else left = [...left.slice(0, -1), ...v4Groups];
  }
  const missing = 8 - left.length - right.length;
  if (tail === undefined ? missing !== 0 : missing < 0) return null;
  const groups = [...left, ...Array(Math.max(0, missing)).fill("0"), ...right];
  const bytes: number[] = [];
  for (const g of groups) {
    if (!/^[0-9a-f]{1,4}$/i.test(g)) return null;
    const n = parseInt(g, 16);
    bytes.push(n >> 8, n & 255);
  }
  return bytes;
}

/** The address as bytes (an IPv4-mapped IPv6 address as its IPv4), or null when it is none. */
export function ipBytes(ip: string): number[] | null {
  const v4 = ipv4Bytes(ip);
  if (v4) return v4;
  const v6 = ipv6Bytes(ip.replace(/^\[|\]$/g, "").split("%")[0]);
  if (!v6) return null;
  const mapped = v6.slice(0, 10).every((b) => b === 0) && v6[10] === 255 && v6[11] === 255;
  return mapped ? v6.slice(12) : v6;
}

interface Cidr {
  bytes: number[];
  prefix: number;
}

export function parseCidrs(list: string): Cidr[] {
  return list
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)
    .flatMap((entry) => {
      const [addr, bits] = entry.split("/");
      const bytes = ipBytes(addr);
      if (!bytes) return [];
      const prefix = bits === undefined ? bytes.length * 8 : Number(bits);
      return Number.isInteger(prefix) && prefix >= 0 && prefix <= bytes.length * 8 ? [{ bytes, prefix }] : [];
    });
}

function inCidr(bytes: number[], net: Cidr): boolean {
  if (bytes.length !== net.bytes.length) return false;
  for (let bit = 0; bit < net.prefix; bit++) {
    const i = bit >> 3;
    const mask = 0x80 >> (bit & 7);
    if ((bytes[i] & mask) !== (net.bytes[i] & mask)) return false;
  }
  return true;
}

/**
 * The client's address: `peer` itself unless it is a trusted proxy; then the right-most address
 * of `chain` (the X-Forwarded-For the proxy sent) that is not a trusted proxy. Null when nothing
 * usable is known.
 */
export function clientIpOf(peer: string | null, chain: string | null, trusted: Cidr[]): string | null {
  const peerIp = peer?.split(",").at(-1)?.trim() ?? "";
  const peerBytes = ipBytes(peerIp);
  if (!peerBytes) return null;
  const isTrusted = (b: number[]) => trusted.some((net) => inCidr(b, net));
  if (!isTrusted(peerBytes)) return peerIp;
  const hops = (chain ?? "").split(",").map((s) => s.trim()).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    const b = ipBytes(hops[i]);
    if (!b) return null; // a malformed hop: believe nothing further left
    if (!isTrusted(b)) return hops[i];
  }
  return peerIp; // every hop is a trusted proxy: the request began inside
}

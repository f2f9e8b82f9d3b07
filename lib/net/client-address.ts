import { BlockList, isIP } from "node:net";

/** The header scripts/serve.mjs writes with each request's socket address (a client's own value is replaced). */
export const PEER_HEADER = "x-ampwright-peer";

/** An IPv4 address written as IPv4-mapped IPv6 (::ffff:203.0.113.5) is the same caller as 203.0.113.5. */
export function normaliseAddress(address: string): string {
  const a = address.trim().replace(/^\[|\]$/g, "");
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(a);
  return (mapped ? mapped[1] : a).toLowerCase();
}

/**
 * The proxies whose X-Forwarded-For entries are believed: addresses or CIDR ranges, comma separated
 * (TRUSTED_PROXIES; default none, so the socket's own address is the caller).
 */
export function parseTrustedProxies(spec: string | undefined): BlockList {
  const list = new BlockList();
  for (const raw of (spec ?? "").split(",").map((s) => s.trim()).filter(Boolean)) {
    const [addr, bits] = raw.split("/");
    const address = normaliseAddress(addr);
    const family = isIP(address);
    if (!family) throw new Error(`TRUSTED_PROXIES: "${raw}" is not an address or CIDR range`);
    const type = family === 6 ? "ipv6" : "ipv4";
    if (bits === undefined) list.addAddress(address, type);
    else {
      const prefix = Number(bits);
      if (!Number.isInteger(prefix) || prefix < 0 || prefix > (family === 6 ? 128 : 32)) throw new Error(`TRUSTED_PROXIES: "${raw}" has a bad prefix length`);
      list.addSubnet(address, prefix, type);
    }
  }
  return list;
}

function trusted(list: BlockList, address: string): boolean {
  const family = isIP(address);
  return family !== 0 && list.check(address, family === 6 ? "ipv6" : "ipv4");
}

let cachedSpec: string | undefined;
let cachedList: BlockList | undefined;
function configuredProxies(): BlockList {
  const spec = process.env.TRUSTED_PROXIES ?? "";
  if (!cachedList || spec !== cachedSpec) {
    cachedList = parseTrustedProxies(spec);
    cachedSpec = spec;
  }
  return cachedList;
}

/**
 * Who is calling, as far as the server can know it: the socket's address, or, when that is a trusted proxy, the
 * right-most X-Forwarded-For hop that is not itself a trusted proxy. Entries a client writes to the left of that
 * are never believed. "unknown" when the request did not come through scripts/serve.mjs (no socket address).
 */
export function clientAddress(headers: Headers, proxies: BlockList = configuredProxies()): string {
  if (process.env.AMPWRIGHT_PEER_HEADER !== "1") return "unknown";
  const peer = normaliseAddress(headers.get(PEER_HEADER) ?? "");
  if (!isIP(peer)) return "unknown";
  if (!trusted(proxies, peer)) return peer;
  const hops = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map(normaliseAddress)
    .filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (!isIP(hops[i])) return peer; // a garbled chain: the last trusted hop is all we know
    if (!trusted(proxies, hops[i])) return hops[i];
  }
  return hops[0] ?? peer;
}

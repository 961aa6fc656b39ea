import "server-only";
import { BlockList, isIP } from "node:net";
import { env, type TrustedProxy } from "@/lib/platform/env";

/**
 * The header scripts/serve.mjs sets from the TCP socket's peer address, overwriting whatever
 * a client sent under that name; it is the only address the app takes on its own word.
 */
export const PEER_HEADER = "x-loopkeeper-peer";

/** Used when no server put the socket address on the request (e.g. `next dev`). */
export const UNKNOWN_CLIENT = "unknown";

type HeaderSource = Headers | Record<string, unknown> | undefined;

function header(headers: HeaderSource, name: string): string | undefined {
  if (!headers) return undefined;
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const v = headers[name];
  return typeof v === "string" ? v : Array.isArray(v) && typeof v[0] === "string" ? v[0] : undefined;
}

/** "::ffff:10.0.0.1" and "10.0.0.1" are one client. */
function normalise(address: string): string {
  const a = address.trim().replace(/^\[|\]$/g, "");
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(a);
  return mapped ? mapped[1]! : a.toLowerCase();
}

let cachedList: { from: TrustedProxy[]; list: BlockList } | undefined;
function trustedList(proxies: TrustedProxy[]): BlockList {
  if (cachedList?.from === proxies) return cachedList.list;
  const list = new BlockList();
  for (const p of proxies) list.addSubnet(p.address, p.prefix, p.family);
  cachedList = { from: proxies, list };
  return list;
}

function isTrusted(address: string, list: BlockList): boolean {
  const family = isIP(address);
  if (family === 0) return false;
  return list.check(address, family === 6 ? "ipv6" : "ipv4");
}

/**
 * The address of the client behind this request. The socket's peer, unless that peer is one
 * of TRUSTED_PROXIES: then X-Forwarded-For is read from the right, skipping trusted proxies,
 * and the first address not in the list is the client. A forwarding header from anyone else
 * is ignored, so a client cannot pick its own throttle bucket.
 */
export function clientAddress(headers: HeaderSource, proxies: TrustedProxy[] = env().TRUSTED_PROXIES): string {
  const peerRaw = header(headers, PEER_HEADER);
  if (!peerRaw) return UNKNOWN_CLIENT;
  const peer = normalise(peerRaw);
  const list = trustedList(proxies);
  if (!isTrusted(peer, list)) return peer;
  const hops = (header(headers, "x-forwarded-for") ?? "")
    .split(",")
    .map(normalise)
    .filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) {
    const hop = hops[i]!;
    if (isIP(hop) === 0) return peer; // a mangled chain names nobody reliably
    if (!isTrusted(hop, list)) return hop;
  }
  return hops[0] ?? peer;
}

import { isIPv4, isIPv6 } from 'node:net';
import type { Request } from 'express';

/**
 * The client's address as a rate-limit tracker. An IPv4-mapped IPv6 address counts as its IPv4
 * address; any other IPv6 address counts as its /64, since one customer usually holds a whole /64
 * (common practice: RFC 6177 recommends /48 to /64 per site, from memory).
 */
export function clientTracker(ip: string | undefined): string {
  if (!ip) return 'unknown';
  const mapped = /^::ffff:(\d{1,3}(?:\.\d{1,3}){3})$/i.exec(ip);
  if (mapped?.[1] && isIPv4(mapped[1])) return mapped[1];
  if (isIPv4(ip) || !isIPv6(ip)) return ip;
  return `${expandIpv6(ip).slice(0, 4).join(':')}::/64`;
}

/** The eight groups of an IPv6 address, lower case, without leading zeros. */
function expandIpv6(ip: string): string[] {
  const withoutZone = ip.split('%')[0] as string;
  // A dotted IPv4 tail stands for the last two groups.
  const dotted = /(\d{1,3}(?:\.\d{1,3}){3})$/.exec(withoutZone);
  let text = withoutZone;
  if (dotted?.[1]) {
    const [a, b, c, d] = dotted[1].split('.').map(Number) as [number, number, number, number];
    text = `${withoutZone.slice(0, dotted.index)}${((a << 8) | b).toString(16)}:${((c << 8) | d).toString(16)}`;
  }
  const [head, tail] = text.split('::') as [string, string | undefined];
  const left = head ? head.split(':') : [];
  const right = tail ? tail.split(':') : [];
  const fill = tail === undefined ? [] : Array<string>(8 - left.length - right.length).fill('0');
  return [...left, ...fill, ...right].map((g) => parseInt(g, 16).toString(16));
}

export const ipTracker = (req: Pick<Request, 'ip'>): string => clientTracker(req.ip);

/** The e-mail a request is about, as stored (lower case), or '' when the body has none. */
export function emailTracker(body: unknown): string {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

/**
 * The address of the person making a request. Directly connected, it is the socket's address.
 * Behind reverse proxies listed in PLUMBLINE_TRUSTED_PROXIES (comma-separated addresses), it is
 * the right-most address in X-Forwarded-For that is not one of those proxies: the hops a client
 * can forge are to the left of what the trusted proxies appended.
 */
export function trustedProxies(): Set<string> {
  return new Set((process.env.PLUMBLINE_TRUSTED_PROXIES ?? '').split(',').map((s) => normalize(s.trim())).filter(Boolean));
}

function normalize(a: string): string {
  return a.startsWith('::ffff:') ? a.slice(7) : a;
}

export function clientAddress(socketAddress: string, headers: Headers, proxies = trustedProxies()): string {
  const direct = normalize(socketAddress);
  if (!proxies.has(direct)) return direct;
  const hops = (headers.get('x-forwarded-for') ?? '').split(',').map((s) => normalize(s.trim())).filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) if (!proxies.has(hops[i]!)) return hops[i]!;
  return direct;
}

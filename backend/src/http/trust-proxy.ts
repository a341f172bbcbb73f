/**
 * Express's `trust proxy` from TRUST_PROXY. Off: the client is the connection's own address and
 * X-Forwarded-For is ignored, so nobody picks the address their requests are counted under. Behind a
 * reverse proxy, name it (addresses or subnets, e.g. `loopback` or `10.0.0.0/8`) or give the number of hops.
 */
export function trustProxySetting(value: string): false | number | string[] {
  const v = value.trim();
  if (v === '' || v.toLowerCase() === 'off') return false;
  if (/^\d+$/.test(v)) return Number(v);
  return v
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
}

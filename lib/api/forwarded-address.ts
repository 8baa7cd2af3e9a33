/**
 * The caller's address from an X-Forwarded-For header, or null when it is not known. The header is
 * read only behind a proxy the app is configured to trust (TRUST_PROXY=true), and then only its last
 * entry: the one that proxy added. Earlier entries are whatever the caller sent. Without a trusted
 * proxy the header is the caller's own words, so the address is unknown. Common practice, no
 * published source.
 */
export function forwardedClientAddress(trustProxy: boolean, forwardedFor: string | null | undefined): string | null {
  if (!trustProxy || !forwardedFor) return null;
  const last = forwardedFor.split(',').at(-1)?.trim();
  return last ? last.slice(0, 64) : null;
}

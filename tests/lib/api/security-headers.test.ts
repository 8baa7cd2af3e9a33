import { describe, expect, it } from 'vitest';
import { pageContentSecurityPolicy, transportSecurityHeaders } from '@/lib/api/security-headers';

describe('transport security', () => {
  it('asks browsers for https only when the app is served over https', () => {
    expect(transportSecurityHeaders('https://needlemap.example')).toEqual([
      { key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' },
    ]);
    expect(transportSecurityHeaders('http://127.0.0.1:3000')).toEqual([]);
    expect(transportSecurityHeaders(undefined)).toEqual([]);
  });

  it('upgrades insecure requests in the page policy only over https', () => {
    expect(pageContentSecurityPolicy('n0nce', { dev: false, https: true })).toContain('upgrade-insecure-requests');
    const plain = pageContentSecurityPolicy('n0nce', { dev: false, https: false });
    expect(plain).not.toContain('upgrade-insecure-requests');
    expect(plain).toContain("script-src 'self' 'nonce-n0nce' 'strict-dynamic'");
    expect(plain).not.toContain('unsafe-eval');
  });
});

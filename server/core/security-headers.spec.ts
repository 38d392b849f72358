import request from 'supertest';
import { startTestApp, type TestApp } from '../testing/test-app';

/** The security headers every answer carries, read as a browser reads them. */
describe('security headers', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  const directive = (csp: string, name: string) =>
    csp
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .find(([n]) => n === name)
      ?.slice(1);

  it.each(['/api/health', '/api/auth/me', '/api/no-such-route'])('%s forbids being framed in both the CSP and X-Frame-Options, saying the same', async (url) => {
    const res = await request(t.app).get(url);
    // frame-ancestors 'none' is X-Frame-Options DENY (RFC 7034 for X-Frame-Options; CSP Level 2, "frame-ancestors"): SAMEORIGIN would let our own pages frame us where CSP says nobody may.
    expect(directive(res.headers['content-security-policy'] ?? '', 'frame-ancestors')).toEqual(["'none'"]);
    expect(res.headers['x-frame-options']).toBe('DENY');
  });
});

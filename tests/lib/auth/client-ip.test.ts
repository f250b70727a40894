import { afterEach, describe, expect, it, vi } from 'vitest';

// clientIp reads the configuration, which is read once per module instance.
async function load(trustProxy: 'on' | 'off') {
  vi.resetModules();
  vi.stubEnv('DATABASE_URL', 'postgres://u:p@127.0.0.1:1/x');
  vi.stubEnv('SEQUENT_TRUST_PROXY', trustProxy);
  return (await import('../../../src/lib/auth/handler')).clientIp;
}

const withHeader = new Request('http://127.0.0.1/', { headers: { 'x-forwarded-for': '203.0.113.9, 10.0.0.1' } });

afterEach(() => vi.unstubAllEnvs());

describe('clientIp(request, socketAddress)', () => {
  it('ignores a client-sent X-Forwarded-For unless a trusted proxy is configured', async () => {
    const clientIp = await load('off');
    expect(clientIp(withHeader, '198.51.100.4')).toBe('198.51.100.4');
  });

  it('takes the first X-Forwarded-For entry behind a trusted proxy', async () => {
    const clientIp = await load('on');
    expect(clientIp(withHeader, '10.0.0.1')).toBe('203.0.113.9');
  });

  it('falls back to the socket address when the proxy sent no header', async () => {
    const clientIp = await load('on');
    expect(clientIp(new Request('http://127.0.0.1/'), '10.0.0.1')).toBe('10.0.0.1');
  });
});

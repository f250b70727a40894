import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import { startApp } from '../helpers/appProcess';

// The shared test server runs with the rate limit off; this file starts its own server with
// it on (the production setting) from the same build.
let base: string;
let stop: () => Promise<void>;

beforeAll(async () => {
  const app = await startApp(inject('databaseUrl'), 'on');
  base = app.url;
  stop = app.stop;
});

afterAll(() => stop?.());

const attempt = (ip?: string) =>
  fetch(`${base}/signin`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base, ...(ip ? { 'x-forwarded-for': ip } : {}) },
    body: new URLSearchParams({ email: 'nobody@firm.example', password: 'wrong-password' }).toString(),
  });

describe('sign-in rate limit (on in production)', () => {
  it('answers 429 with a clear message after 10 attempts a minute from one address', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 10; i += 1) statuses.push((await attempt()).status);
    expect(statuses.every((s) => s === 401)).toBe(true);
    const limited = await attempt();
    expect(limited.status).toBe(429);
    expect(await limited.text()).toContain('Too many sign-in attempts. Wait a minute and try again.');
  });

  it('does not let a client dodge the limit with its own X-Forwarded-For header', async () => {
    expect((await attempt('203.0.113.77')).status).toBe(429);
  });
});

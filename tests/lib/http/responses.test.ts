import { z } from 'zod';
import { describe, expect, it } from 'vitest';
import { jsonError, parseJsonBody } from '../../../src/lib/http/responses';

const schema = z.object({ role: z.enum(['a', 'b']) });
const request = (body: string) => new Request('http://127.0.0.1/x', { method: 'POST', body });

describe('parseJsonBody(request, schema)', () => {
  it('returns the typed data of a valid body', async () => {
    expect(await parseJsonBody(request('{"role":"a"}'), schema)).toEqual({ ok: true, data: { role: 'a' } });
  });

  it('answers 400 for a body that is not JSON', async () => {
    const result = await parseJsonBody(request('{nope'), schema);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.response.status).toBe(400);
  });

  it('answers 422 with the issues of a body that does not fit', async () => {
    const result = await parseJsonBody(request('{"role":"c"}'), schema);
    if (result.ok) throw new Error('expected a failure');
    expect(result.response.status).toBe(422);
    const body = await result.response.json();
    expect(body.error.code).toBe('invalid_input');
    expect(body.error.issues[0].path).toBe('role');
  });
});

describe('jsonError(status, code, message)', () => {
  it('answers JSON with the status and no cache', async () => {
    const response = jsonError(404, 'not_found', 'Gone.');
    expect(response.status).toBe(404);
    expect(response.headers.get('content-type')).toContain('application/json');
    expect(response.headers.get('cache-control')).toBe('no-store');
    expect(await response.json()).toEqual({ error: { code: 'not_found', message: 'Gone.' } });
  });
});

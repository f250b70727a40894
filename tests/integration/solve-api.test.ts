import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { beforeAll, describe, expect, it } from 'vitest';
import { call, sessionOf } from '../helpers/app';
import { makeFirm, TEST_PASSWORD } from '../helpers/firms';

const run = promisify(execFile);
let cookie: string;

beforeAll(async () => {
  const f = await makeFirm({ eng: 'engineer' });
  cookie = await sessionOf(f.people.eng!.email, TEST_PASSWORD);
});

// Bélanger equation, rectangular channel (Chow 1959, Open-Channel Hydraulics, §15-2).
const belanger = (q: number, y1: number) => {
  const fr1 = q / (y1 * Math.sqrt(9.80665 * y1));
  return (y1 / 2) * (Math.sqrt(1 + 8 * fr1 * fr1) - 1);
};

describe('POST /api/v1/solve', () => {
  it('needs a session (401)', async () => {
    const response = await call('/api/v1/solve', { json: { kind: 'jump', inputs: {} } });
    expect(response.status).toBe(401);
  });

  it('solves one calculation with units per value and carries the caution', async () => {
    const response = await call('/api/v1/solve', {
      cookie,
      json: { kind: 'jump', inputs: { shape: 'rectangular', b: '12 m', Q: { value: 85, unit: 'm3/s' }, y1: 0.62 } },
    });
    expect(response.status).toBe(200);
    const body = await response.json();
    const y2 = body.result.outputs.find((o: { name: string }) => o.name === 'y2');
    expect(y2.si).toBeCloseTo(belanger(85 / 12, 0.62), 9);
    expect(y2.unit).toBe('m');
    expect(body.caution).toContain('licensed engineer');
  });

  it('answers US customary results when asked', async () => {
    const response = await call('/api/v1/solve', { cookie, json: { kind: 'hydraulic-jump', units: 'US', inputs: { b: 10, Q: 500, y1: 1.2 } } });
    const body = await response.json();
    expect(body.result.outputs.find((o: { name: string }) => o.name === 'y2').unit).toBe('ft');
  });

  it('answers 422 with the input at fault', async () => {
    const response = await call('/api/v1/solve', { cookie, json: { kind: 'jump', inputs: { b: '12 m3/s', Q: 85, y1: 0.62 } } });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.issues[0].path).toBe('inputs.b');
  });

  it('answers 422 when no jump is possible, naming y1', async () => {
    const response = await call('/api/v1/solve', { cookie, json: { kind: 'jump', inputs: { b: 12, Q: 85, y1: 3 } } });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.issues[0]).toMatchObject({ path: 'inputs.y1' });
    expect(body.error.issues[0].message).toContain('no hydraulic jump can form');
  });

  it('screens stilling basins over a list of flows, with the basin caution and the short flow named', async () => {
    // Invented flows; the second one's tailwater is short of USBR II's 1.05·y2 (Peterka 1958, from memory).
    const response = await call('/api/v1/solve', {
      cookie,
      json: { kind: 'basin', inputs: { Q: '84, 135, 192 m3/s', b: '10 m', y1: [0.6, 0.9, 1.2], TW: [5.0, 4.5, 7.2], family: 'usbr2' } },
    });
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.result.kind).toBe('stilling-basin');
    expect(body.result.outputs.find((o: { name: string }) => o.name === 'family').si).toBe('USBR II');
    expect(body.result.table.rows).toHaveLength(5);
    expect(body.result.caution).toContain('physical model study');
    expect(body.result.warnings.find((w: { code: string }) => w.code === 'tailwater-too-low').message).toContain('Q = 135 m³/s');
  });

  it.each([
    [{ y1: 0.5, V1: 1.5, TW: 2 }, 'inputs.y1', 'not supercritical'],
    [{ y1: 0.5, V1: 12 }, 'inputs.tailwater', 'give TW'],
  ])('answers 422 for a basin with bad input %j', async (inputs, path, message) => {
    const response = await call('/api/v1/solve', { cookie, json: { kind: 'basin', inputs } });
    expect(response.status).toBe(422);
    const issue = (await response.json()).error.issues[0];
    expect(issue.path).toBe(path);
    expect(issue.message).toContain(message);
  });

  it.each([
    [{ kind: 'warp-drive', inputs: {} }, 'kind'],
    [{ kind: 'jump', inputs: { b: { value: 'x', unit: 'm' } } }, 'inputs.b'],
    [{ kind: 'jump' }, 'inputs'],
    [{ kind: 'jump', inputs: {}, extra: 1 }, '(body)'],
  ])('answers 422 for a malformed request %j', async (json, path) => {
    const response = await call('/api/v1/solve', { cookie, json });
    expect(response.status).toBe(422);
    expect((await response.json()).error.issues.map((i: { path: string }) => i.path)).toContain(path);
  });
});

describe('POST /api/v1/evaluate', () => {
  it('needs a session (401)', async () => {
    expect((await call('/api/v1/evaluate', { json: { markdown: '' } })).status).toBe(401);
  });

  it('evaluates every block of a case body, errors with line numbers', async () => {
    const markdown = ['# Outlet', '', '```jump basin', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m', '```', '', '```jump', 'b = ?', '```'].join('\n');
    const response = await call('/api/v1/evaluate', { cookie, json: { markdown } });
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.blocks.map((b: { status: string }) => b.status)).toEqual(['ok', 'error']);
    expect(body.blocks[1].errors[0].line).toBe(10);
    expect(body.solverVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('refuses a body over 200,000 characters (422)', async () => {
    const response = await call('/api/v1/evaluate', { cookie, json: { markdown: 'x'.repeat(200_001) } });
    expect(response.status).toBe(422);
  });
});

describe('npm run solve (scripts/solve.ts)', () => {
  const solve = (input: string) => {
    const child = run('npx', ['tsx', 'scripts/solve.ts', '-'], { cwd: process.cwd() });
    child.child.stdin!.end(input);
    return child;
  };

  it('solves a batch from standard input and exits 0', async () => {
    const { stdout } = await solve(JSON.stringify([{ kind: 'jump', inputs: { b: 12, Q: 85, y1: 0.62 } }, { kind: 'toe', inputs: { b: 12, Q: 85, H: 9.5 } }]));
    const body = JSON.parse(stdout);
    expect(body.results.map((r: { ok: boolean }) => r.ok)).toEqual([true, true]);
    expect(body.caution).toContain('licensed engineer');
  });

  it('exits 2 with a clear message for invalid input', async () => {
    await expect(solve('{"kind":"jump","inputs":{"b":12,"Q":85,"y1":3}}')).rejects.toMatchObject({
      code: 2,
      stderr: expect.stringContaining('y1: Fr1'),
    });
    await expect(solve('not json')).rejects.toMatchObject({ code: 2, stderr: expect.stringContaining('The input is not JSON') });
  });
});

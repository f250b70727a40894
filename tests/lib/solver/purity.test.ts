/**
 * The solver must stay pure (STYLE §6): no imports from outside src/lib/solver, no I/O,
 * no clock, no randomness, no console. A static scan of the sources guards it.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const dir = 'src/lib/solver';
const files = readdirSync(dir).filter((f) => f.endsWith('.ts'));

describe.each(files)('src/lib/solver/%s', (file) => {
  const text = readFileSync(`${dir}/${file}`, 'utf8');

  it('imports only sibling solver modules', () => {
    for (const m of text.matchAll(/from\s+'([^']+)'/g)) expect(m[1]).toMatch(/^\.\/[A-Za-z]+$/);
  });

  it('uses no clock, randomness, console or globals', () => {
    expect(text).not.toMatch(/\bDate\b|Math\.random|console\.|globalThis|process\.|window\./);
  });

  it('stays under 300 lines', () => {
    expect(text.split('\n').length).toBeLessThan(300);
  });
});

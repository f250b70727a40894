import { describe, expect, it } from 'vitest';
import { brent } from '@/lib/solver/brent';

describe('brent(f, a, b, xTol)', () => {
  it('returns NaN when the interval is not a sign-change bracket', () => {
    expect(brent((x) => x * x + 1, -1, 1, 1e-12)).toBeNaN();
  });

  it('returns NaN when f is not finite at an end', () => {
    expect(brent(() => Number.NaN, 0, 1, 1e-12)).toBeNaN();
    expect(brent((x) => (x === 0 ? Infinity : x - 0.5), 0, 1, 1e-12)).toBeNaN();
  });

  it('returns an end point that is already a root', () => {
    expect(brent((x) => x - 1, 1, 2, 1e-12)).toBe(1);
    expect(brent((x) => x - 2, 1, 2, 1e-12)).toBe(2);
  });

  describe.each([
    { name: '√2 from x² − 2', f: (x: number) => x * x - 2, a: 0, b: 2, root: Math.SQRT2 },
    { name: 'cos x = x (Dottie number)', f: (x: number) => Math.cos(x) - x, a: 0, b: 1, root: 0.7390851332151607 },
    { name: 'a flat cubic (x − 1)³', f: (x: number) => (x - 1) ** 3, a: -3, b: 4, root: 1 },
    { name: 'a step-like tanh', f: (x: number) => Math.tanh(50 * (x - 0.3)), a: -10, b: 10, root: 0.3 },
  ])('$name', ({ f, a, b, root }) => {
    it('converges to the known root within the tolerance, with the bracket in either order', () => {
      expect(brent(f, a, b, 1e-13)).toBeCloseTo(root, 5);
      expect(brent(f, b, a, 1e-13)).toBeCloseTo(root, 5);
    });
  });
});

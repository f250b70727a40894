/**
 * Independent test oracle: section properties by thin-strip (midpoint) integration of the
 * top width T(η), written without the solver's closed forms.
 */
import type { Section } from '@/lib/solver/section';

/** Top width at height η above the invert, from the section's plane geometry. */
export function stripTopWidth(s: Section, eta: number): number {
  switch (s.shape) {
    case 'rectangular':
      return s.width;
    case 'trapezoidal':
      return s.width + 2 * s.sideSlope * eta;
    case 'triangular':
      return 2 * s.sideSlope * eta;
    case 'circular': {
      const r = s.diameter / 2;
      const h = eta - r;
      return 2 * Math.sqrt(Math.max(0, r * r - h * h));
    }
  }
}

const N = 4000;

// Strips refine towards the invert (η = y·u²) so the circle's √η edge is integrated accurately.
function integrate(y: number, f: (eta: number) => number): number {
  let sum = 0;
  for (let i = 0; i < N; i++) {
    const u = (i + 0.5) / N;
    sum += f(y * u * u) * 2 * u * (y / N);
  }
  return sum;
}

/** A = ∫₀ʸ T dη. */
export function stripArea(s: Section, y: number): number {
  return integrate(y, (eta) => stripTopWidth(s, eta));
}

/** A·ȳ = ∫₀ʸ (y − η) T dη. */
export function stripFirstMoment(s: Section, y: number): number {
  return integrate(y, (eta) => (y - eta) * stripTopWidth(s, eta));
}

/** M = Q²/(gA) + A·ȳ from the strips. */
export function stripMomentum(s: Section, q: number, y: number, g: number): number {
  return (q * q) / (g * stripArea(s, y)) + stripFirstMoment(s, y);
}

/** Plain bisection, 100 halvings, on a caller-verified sign change. */
export function bisect(f: (x: number) => number, a: number, b: number): number {
  let fa = f(a);
  for (let i = 0; i < 100; i++) {
    const m = 0.5 * (a + b);
    const fm = f(m);
    if (fm === 0) return m;
    if (fm > 0 === fa > 0) {
      a = m;
      fa = fm;
    } else b = m;
  }
  return 0.5 * (a + b);
}

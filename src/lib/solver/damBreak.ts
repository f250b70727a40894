/**
 * Instantaneous dam break onto a wet, horizontal, frictionless bed with both sides at rest:
 * a rarefaction fan upstream, a uniform middle state (h2, u2) and a bore downstream.
 * Source: Stoker, J. J., 1957, Water Waves, ch. 10 §10.8 (from memory): the middle state
 * satisfies u2 + 2√(g·h2) = 2√(g·h0) (Riemann invariant through the fan) and the bore
 * relations s = √(g·h2·(h1 + h2)/(2h1)), u2 = s·(1 − h1/h2).
 * As h1 → 0 it tends to Ritter's (1892) dry-bed solution, front speed 2√(g·h0).
 */
import { brent } from './brent';
import { STANDARD_GRAVITY } from './constants';
import { fail, type SolverResult, type Warning } from './result';
import { boreFront, boreFrontWarnings, type BoreFront } from './surge';
import { checkPhysics, checkPositive, noConvergence } from './validate';

/** Input of {@link solveDamBreak}; SI units. */
export interface DamBreakInput {
  /** Still-water depth upstream of the dam h0, m. */
  readonly upstreamDepth: number;
  /** Still-water depth downstream h1, m (0 < h1 < h0). */
  readonly downstreamDepth: number;
  /** Optional time after the break t, s, for positions. */
  readonly time?: number;
  /** Gravity, m/s². */
  readonly g?: number;
}

/** Result of {@link solveDamBreak}. Velocities and speeds positive downstream. */
export interface DamBreakResult {
  /** Depth behind the front h2, m. */
  readonly depthBehind: number;
  /** Velocity behind the front u2, m/s. */
  readonly velocityBehind: number;
  /** Bore (front) speed s, m/s. */
  readonly frontSpeed: number;
  /** Front height h2 − h1, m. */
  readonly frontHeight: number;
  /** Bore Froude number s/√(g·h1). */
  readonly frontFroude: number;
  /** Front type by the bore Froude number. */
  readonly frontType: BoreFront;
  /** Speed of the head of the rarefaction fan −√(g·h0), m/s. */
  readonly fanHeadSpeed: number;
  /** Speed of the tail of the fan u2 − √(g·h2), m/s. */
  readonly fanTailSpeed: number;
  /** Depth at the dam site (x = 0) for t > 0, m. */
  readonly depthAtDam: number;
  /** Velocity at the dam site, m/s. */
  readonly velocityAtDam: number;
  /** Unit discharge through the dam site, m²/s. */
  readonly unitDischargeAtDam: number;
  /** Ritter's dry-bed front speed 2√(g·h0), for comparison, m/s. */
  readonly ritterFrontSpeed: number;
  /** Front position s·t at `time`, m (`null` without a time). */
  readonly frontPosition: number | null;
  /** Position of the negative wave's head −√(g·h0)·t, m (`null` without a time). */
  readonly fanHeadPosition: number | null;
}

/**
 * Solves Stoker's wet-bed dam break by a bracketed root of
 * F(h2) = 2(√(g·h0) − √(g·h2)) − s(h2)·(1 − h1/h2) on (h1, h0), where F(h1) > 0 > F(h0).
 */
export function solveDamBreak(input: DamBreakInput): SolverResult<DamBreakResult> {
  const { upstreamDepth: h0, downstreamDepth: h1 } = input;
  const g = input.g ?? STANDARD_GRAVITY;
  const bad =
    checkPositive(h0, 'upstreamDepth', 'Upstream depth h0') ??
    checkPositive(h1, 'downstreamDepth', 'Downstream depth h1 (use a small value for a nearly dry bed)') ??
    checkPhysics(g, undefined) ??
    (input.time === undefined ? null : checkPositive(input.time, 'time', 'Time t'));
  if (bad) return bad;
  if (!(h1 < h0)) {
    return fail('invalid-input', `The downstream depth h1 = ${h1} m must be less than the upstream depth h0 = ${h0} m; otherwise the wave runs the other way (swap them) or nothing moves.`, 'downstreamDepth');
  }
  const c0 = Math.sqrt(g * h0);
  const speed = (h2: number): number => Math.sqrt((g * h2 * (h1 + h2)) / (2 * h1));
  const f = (h2: number): number => 2 * (c0 - Math.sqrt(g * h2)) - speed(h2) * (1 - h1 / h2);
  const h2 = brent(f, h1, h0, 1e-14 * h0);
  if (Number.isNaN(h2)) return noConvergence('the depth behind the dam-break front');
  const s = speed(h2);
  const u2 = s * (1 - h1 / h2);
  const c2 = Math.sqrt(g * h2);
  const tail = u2 - c2;
  // Fan: u = (2/3)(c0 + x/t), c = (1/3)(2c0 − x/t); at x = 0 if the fan spans the dam site.
  const fanAtDam = tail > 0;
  const depthAtDam = fanAtDam ? (4 * h0) / 9 : h2;
  const velocityAtDam = fanAtDam ? (2 / 3) * c0 : u2;
  const frontFroude = s / Math.sqrt(g * h1);
  const t = input.time;
  const value: DamBreakResult = {
    depthBehind: h2,
    velocityBehind: u2,
    frontSpeed: s,
    frontHeight: h2 - h1,
    frontFroude,
    frontType: boreFront(frontFroude),
    fanHeadSpeed: -c0,
    fanTailSpeed: tail,
    depthAtDam,
    velocityAtDam,
    unitDischargeAtDam: depthAtDam * velocityAtDam,
    ritterFrontSpeed: 2 * c0,
    frontPosition: t === undefined ? null : s * t,
    fanHeadPosition: t === undefined ? null : -c0 * t,
  };
  const warnings: Warning[] = [];
  boreFrontWarnings(frontFroude, warnings);
  if (h1 / h0 < 0.01) {
    warnings.push({ code: 'nearly-dry-bed', message: `h1/h0 = ${(h1 / h0).toPrecision(2)} is small: bed friction and turbulence dominate the thin front on a nearly dry bed, so the ideal front speed is an upper bound (Dressler 1952; from memory).` });
  }
  return { ok: true, value, warnings };
}

/** Water depth and velocity of Stoker's solution at position `x` (m, dam at 0) and time `t` > 0 (s). */
export function damBreakProfile(r: DamBreakResult, h0: number, h1: number, x: number, t: number, g = STANDARD_GRAVITY): { depth: number; velocity: number } {
  const xi = x / t;
  const c0 = Math.sqrt(g * h0);
  if (xi <= -c0) return { depth: h0, velocity: 0 };
  if (xi < r.fanTailSpeed) {
    const c = (2 * c0 - xi) / 3;
    return { depth: (c * c) / g, velocity: (2 / 3) * (c0 + xi) };
  }
  if (xi < r.frontSpeed) return { depth: r.depthBehind, velocity: r.velocityBehind };
  return { depth: h1, velocity: 0 };
}

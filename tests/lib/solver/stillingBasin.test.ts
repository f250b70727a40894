/**
 * Stilling-basin screening. Sources of the checks (all recalled, "from memory"):
 * - Peterka, A. J., 1958, Hydraulic Design of Stilling Basins and Energy Dissipators, USBR
 *   Engineering Monograph 25: Basin I (natural jump, L ≈ 6.1·y2), Basin II (Fr1 ≥ 4.5,
 *   q ≤ 500 ft²/s, L ≈ 4.3·y2, TW = 1.05·y2, chute blocks y1, dentated sill 0.2·y2 with teeth
 *   0.15·y2), Basin III (Fr1 ≥ 4.5, V1 ≤ 60 ft/s, q ≤ 200 ft²/s, L ≈ 2.7·y2, baffle piers
 *   h3/y1 = 0.168·Fr1 + 0.63 at 0.8·y2, end sill h4/y1 = 1 + Fr1/18), Basin IV
 *   (2.5 ≤ Fr1 ≤ 4.5, chute blocks 2·y1 high, TW = 1.1·y2, end sill 1.25·y1).
 * - Blaisdell, F. W., 1948, Development and hydraulic design, Saint Anthony Falls stilling
 *   basin, Trans. ASCE 113: 1.7 ≤ Fr1 ≤ 17, L = 4.5·y2/Fr1^0.76, TW factors 1.10 − Fr1²/120
 *   (1.7–5.5), 0.85 (5.5–11), 1.00 − Fr1²/800 (11–17), floor blocks at L/3, sill 0.07·y2.
 * - Chow, V. T., 1959, Open-Channel Hydraulics, §15-2, eq. 15-3 (Bélanger), checked here
 *   independently by the momentum balance per unit width.
 * - Froude similarity (an exact property of the relations): scaling y1 by k and V1 by √k keeps
 *   Fr1 and scales every length by k.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { safTailwaterFactor } from '@/lib/solver/basinFamilies';
import { screenStillingBasins, type StillingBasinInput } from '@/lib/solver/stillingBasin';
import { solve } from '@/lib/solver';

const g = 9.80665;
/** The velocity that gives Froude number `fr` at depth `y1`. */
const vFor = (fr: number, y1: number) => fr * Math.sqrt(g * y1);
const belanger = (fr: number) => 0.5 * (Math.sqrt(1 + 8 * fr * fr) - 1);

const base: StillingBasinInput = { y1: [0.5], v1: [vFor(6, 0.5)], tailwater: [10], family: 'auto', maxSubmergence: 10, g };

function run(input: Partial<StillingBasinInput>) {
  const r = screenStillingBasins({ ...base, ...input });
  if (!r.ok) throw new Error(`${r.error.code}: ${r.error.message}`);
  return r;
}
const row = (r: ReturnType<typeof run>, label: string) => r.value.rows.find((x) => x.family === label)!;
const fits = (fr: number, label: string, y1 = 0.5) => row(run({ y1: [y1], v1: [vFor(fr, y1)] }), label).fits;

describe('family ranges at their boundaries', () => {
  it.each([
    // [label, Fr1 just inside, Fr1 just outside] — Peterka 1958 and Blaisdell 1948 (from memory).
    ['Natural jump (USBR I)', 1.7, 1.69],
    ['USBR II', 4.5, 4.49],
    ['USBR III', 4.5, 4.49],
    ['USBR IV', 2.5, 2.49],
    ['USBR IV', 4.5, 4.51],
    ['SAF', 1.7, 1.69],
    ['SAF', 17, 17.01],
  ])('%s: Fr1 = %s is inside, %s outside', (label, inside, outside) => {
    expect(fits(inside, label, 0.1)).toBe('yes');
    expect(fits(outside, label, 0.1)).toBe('no');
  });

  it('USBR III stops at V1 = 60 ft/s (18.288 m/s) and says why', () => {
    // y1 = 1.2 m, Fr1 ≥ 4.5 needs V1 ≥ 15.4 m/s; q stays below 18.6 m²/s only up to V1 = 15.5 m/s,
    // so use a shallower toe to reach the velocity limit first.
    const at = (v1: number) => row(run({ y1: [0.9], v1: [v1] }), 'USBR III');
    expect(at(18.28).fits).toBe('yes');
    const out = at(18.3);
    expect(out.fits).toBe('no');
    expect(out.why).toBe('V1 = 18.3 m/s is above 18.29 m/s (60 ft/s) (baffle piers would cavitate)');
  });

  it('USBR III stops at q = 200 ft²/s (18.58 m²/s)', () => {
    const at = (q: number) => row(run({ y1: [1.1], v1: [q / 1.1] }), 'USBR III');
    expect(at(18.58).fits).toBe('yes');
    expect(at(18.6).why).toBe('q = 18.6 m²/s is above 18.58 m²/s (200 ft²/s)');
  });

  it('USBR II stops at q = 500 ft²/s (46.45 m²/s)', () => {
    const at = (q: number) => row(run({ y1: [1.5], v1: [q / 1.5] }), 'USBR II');
    expect(at(46.45).fits).toBe('yes');
    expect(at(46.46).fits).toBe('no');
  });

  it('names the first flow outside the range and counts the others', () => {
    const r = run({ y1: [0.5], v1: [vFor(5, 0.5), vFor(4, 0.5), vFor(3.5, 0.5)], tailwater: [10], discharges: [100, 80, 70] });
    expect(row(r, 'USBR II').why).toBe('Fr1 = 4 is below 4.5 at Q = 80 m³/s (and 1 more flow)');
    expect(row(r, 'USBR IV').why).toBe('Fr1 = 5 is above 4.5 at Q = 100 m³/s');
    expect(row(r, 'SAF').why).toBe('inside: Fr1 3.5–5');
  });
});

describe('lengths, tailwater and elements inside each range', () => {
  const y1 = 0.4;
  const fr = 8;
  const y2 = y1 * belanger(fr);
  const at = (family: StillingBasinInput['family']) => run({ y1: [y1], v1: [vFor(fr, y1)], family }).value;

  it('Bélanger y2 satisfies the momentum balance per unit width (Chow 1959, §15-2)', () => {
    const v = at('auto');
    const q = v.q;
    const m = (y: number) => (q * q) / (g * y) + (y * y) / 2;
    expect(m(v.y2)).toBeCloseTo(m(v.y1), 9);
  });

  it('natural jump: L = 6.1·y2, TW = y2, no elements (Peterka 1958, Basin I)', () => {
    const v = at('natural');
    expect(v.basinLength).toBeCloseTo(6.1 * y2, 9);
    expect(v.requiredTailwater).toBeCloseTo(y2, 9);
    expect([v.chuteBlockHeight, v.baffleHeight, v.endSillHeight]).toEqual([null, null, null]);
  });

  it('USBR II: L = 4.3·y2, TW = 1.05·y2, chute blocks y1, dentated sill 0.2·y2 (Peterka 1958, Basin II)', () => {
    const v = at('usbr2');
    expect(v.basinLength).toBeCloseTo(4.3 * y2, 9);
    expect(v.requiredTailwater).toBeCloseTo(1.05 * y2, 9);
    expect([v.chuteBlockHeight, v.chuteBlockWidth, v.chuteBlockSpacing]).toEqual([y1, y1, y1]);
    expect(v.endSillHeight).toBeCloseTo(0.2 * y2, 9);
    expect(v.sillToothWidth).toBeCloseTo(0.15 * y2, 9);
    expect(v.baffleHeight).toBeNull();
  });

  it('USBR III: L = 2.7·y2, baffles h3 = y1(0.168·Fr1 + 0.63) at 0.8·y2, sill y1(1 + Fr1/18) (Peterka 1958, Basin III)', () => {
    const v = at('usbr3');
    expect(v.family).toBe('USBR III');
    expect(v.basinLength).toBeCloseTo(2.7 * y2, 9);
    expect(v.baffleHeight).toBeCloseTo(y1 * (0.168 * fr + 0.63), 9);
    expect(v.baffleWidth).toBeCloseTo(0.75 * v.baffleHeight!, 9);
    expect(v.baffleDistance).toBeCloseTo(0.8 * y2, 9);
    expect(v.endSillHeight).toBeCloseTo(y1 * (1 + fr / 18), 9);
  });

  it('USBR IV: L = 6.1·y2, TW = 1.1·y2, chute blocks 2·y1 high at 2.5·y1, sill 1.25·y1 (Peterka 1958, Basin IV)', () => {
    const v = run({ y1: [y1], v1: [vFor(3.5, y1)], family: 'usbr4' }).value;
    const y2iv = y1 * belanger(3.5);
    expect(v.basinLength).toBeCloseTo(6.1 * y2iv, 9);
    expect(v.requiredTailwater).toBeCloseTo(1.1 * y2iv, 9);
    expect([v.chuteBlockHeight, v.chuteBlockSpacing, v.endSillHeight]).toEqual([2 * y1, 2.5 * y1, 1.25 * y1]);
  });

  it('SAF: L = 4.5·y2/Fr1^0.76, floor blocks at L/3, sill 0.07·y2 (Blaisdell 1948)', () => {
    const v = at('saf');
    const L = (4.5 * y2) / fr ** 0.76;
    expect(v.basinLength).toBeCloseTo(L, 9);
    expect(v.baffleDistance).toBeCloseTo(L / 3, 9);
    expect(v.chuteBlockWidth).toBeCloseTo(0.75 * y1, 9);
    expect(v.endSillHeight).toBeCloseTo(0.07 * y2, 9);
    expect(v.tailwaterFactor).toBe(0.85);
  });

  it('SAF tailwater factor by range, continuous at Fr1 = 5.5 and 11 to about 0.25 % (Blaisdell 1948)', () => {
    expect(safTailwaterFactor(3)).toBeCloseTo(1.1 - 9 / 120, 12);
    expect(safTailwaterFactor(8)).toBe(0.85);
    expect(safTailwaterFactor(14)).toBeCloseTo(1 - 196 / 800, 12);
    expect(Math.abs(safTailwaterFactor(5.5) - safTailwaterFactor(5.5001))).toBeLessThan(0.0025);
    expect(Math.abs(safTailwaterFactor(11) - safTailwaterFactor(11.0001))).toBeLessThan(0.0025);
  });

  it('auto follows the monograph: III where allowed, II above 18.3 m/s, IV in 2.5–4.5, the natural jump in 1.7–2.5', () => {
    expect(run({ y1: [0.4], v1: [vFor(8, 0.4)] }).value.family).toBe('USBR III');
    expect(run({ y1: [1.0], v1: [20] }).value.family).toBe('USBR II');
    expect(run({ y1: [0.4], v1: [vFor(3.5, 0.4)] }).value.family).toBe('USBR IV');
    expect(run({ y1: [0.4], v1: [vFor(2, 0.4)] }).value.family).toBe('Natural jump (USBR I)');
  });
});

describe('tailwater over a flow range', () => {
  // Three flows of a fictional spillway; the middle one has too little tailwater.
  const y1 = [0.3, 0.45, 0.6];
  const v1 = [14, 15, 16];
  const y2 = y1.map((y, i) => y * belanger(v1[i]! / Math.sqrt(g * y)));
  const input = { y1, v1, discharges: [84, 135, 192], family: 'usbr2' as const, tailwater: [y2[0]! * 1.1, y2[1]! * 0.98, y2[2]! * 1.1] };

  it('flags the flow whose tailwater is below 1.05·y2 with that flow and the shortfall', () => {
    const r = run(input);
    const w = r.warnings.find((x) => x.code === 'tailwater-too-low')!;
    expect(w.message).toContain('at 1 of 3 flows');
    expect(w.message).toContain('Q = 135 m³/s');
    expect(w.field).toBe('tailwater');
    expect(r.value.governingDischarge).toBe(135);
    expect(r.value.margin).toBeCloseTo(y2[1]! * 0.98 - 1.05 * y2[1]!, 9);
    expect(r.value.sweptOutCount).toBe(1);
    // The basin is sized for the flow that needs the longest basin (the largest).
    expect(r.value.designDischarge).toBe(192);
    expect(r.value.basinLength).toBeCloseTo(4.3 * y2[2]!, 9);
  });

  it('names flows by number when no discharges are given', () => {
    const { discharges: _, ...rest } = input;
    const w = run(rest).warnings.find((x) => x.code === 'tailwater-too-low')!;
    expect(w.message).toContain('flow 2 (TW');
  });

  it('warns of excessive submergence above the limit (common practice, 20 %)', () => {
    const r = run({ ...input, tailwater: y2.map((y) => y * 1.3), maxSubmergence: 0.2 });
    expect(r.warnings.map((w) => w.code)).toContain('excessive-submergence');
    expect(run({ ...input, tailwater: y2.map((y) => y * 1.1), maxSubmergence: 0.2 }).warnings.map((w) => w.code)).not.toContain('excessive-submergence');
  });
});

describe('warnings engineers expect', () => {
  const codes = (input: Partial<StillingBasinInput>) => run(input).warnings.map((w) => w.code);
  it('cavitation on baffles above 18.3 m/s when a baffled family is sized', () => {
    expect(codes({ y1: [0.5], v1: [20], family: 'saf' })).toContain('baffle-cavitation');
    expect(codes({ y1: [0.5], v1: [20], family: 'usbr2' })).not.toContain('baffle-cavitation');
  });
  it('waves in the oscillating range', () => expect(codes({ v1: [vFor(3, 0.5)] })).toContain('oscillating-jump'));
  it('undular jump below Fr1 = 1.7, and no family fits', () => {
    const r = run({ v1: [vFor(1.5, 0.5)] });
    expect(r.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['undular-jump', 'no-basin-family']));
    expect(r.value.family).toBe('none');
    expect(r.value.basinLength).toBeNull();
  });
  it('a family asked for outside its range is sized, with the reason', () => {
    const r = run({ v1: [vFor(3, 0.5)], family: 'usbr3' });
    expect(r.value.family).toBe('USBR III');
    expect(r.warnings.find((w) => w.code === 'family-outside-range')?.message).toContain('Fr1 = 3 is below 4.5');
  });
});

describe('messages in the block\'s units', () => {
  it('quote US figures in a US block, and the source\'s own limit', () => {
    const r = run({ y1: [0.3048], v1: [20 * 0.3048 * 3.2], tailwater: [0.5], discharges: [50 * 0.0283168], family: 'usbr3', unitSystem: 'US' });
    const messages = r.warnings.map((w) => w.message).join(' ');
    expect(messages).toContain('Q = 50 ft³/s (TW 1.64 ft, needs');
    expect(row(r, 'USBR III').why).toBe('V1 = 64 ft/s is above 60 ft/s (baffle piers would cavitate) at Q = 50 ft³/s');
    expect(messages).toContain('V1 = 64 ft/s is above 60 ft/s:');
    expect(messages).not.toMatch(/\d m\b|m\/s|m³/);
  });
});

describe('bad input gives clear messages', () => {
  it('subcritical inflow', () => {
    const r = screenStillingBasins({ ...base, v1: [1] });
    expect(!r.ok && r.error.code).toBe('subcritical-inflow');
    expect(!r.ok && r.error.message).toMatch(/not supercritical: Fr1 = 0\.452.*needs Fr1 > 1/);
  });
  it.each([
    ['lists that do not line up', { y1: [0.3, 0.4], v1: [10, 11, 12] }, /do not line up: y1 has 2, V1 has 3/],
    ['a zero depth', { y1: [0] }, /toe depth must be a positive number/],
    ['a NaN tailwater', { tailwater: [Number.NaN] }, /tailwater depth must be a positive number/],
    ['too many flows', { y1: Array.from({ length: 201 }, () => 0.5) }, /At most 200 flows/],
  ])('%s', (_t, input, message) => {
    const r = screenStillingBasins({ ...base, ...input });
    expect(!r.ok && r.error.message).toMatch(message);
  });
  it('no tailwater, through the kind', () => {
    const r = solve('stilling-basin', { y1: [0.5], velocities: [12] });
    expect(!r.ok && r.error.message).toMatch(/screened against the tailwater it will have: give TW/);
  });
  it('the discharge with width gives the velocity Q/(b·y1)', () => {
    const r = solve('stilling-basin', { y1: [0.5], discharges: [60], width: 10, tailwater: [4] });
    expect(r.ok && r.value.values['v1']).toBeCloseTo(12, 12);
  });
});

describe('properties', () => {
  const flow = fc.record({ y1: fc.double({ min: 0.02, max: 3, noNaN: true }), fr: fc.double({ min: 1.05, max: 25, noNaN: true }), tw: fc.double({ min: 0.3, max: 2, noNaN: true }) });

  it('never throws, and a family fits exactly when no flow is outside its range', () => {
    fc.assert(
      fc.property(fc.array(flow, { minLength: 1, maxLength: 6 }), fc.constantFrom('auto', 'natural', 'usbr2', 'usbr3', 'usbr4', 'saf'), (flows, family) => {
        const y1 = flows.map((f) => f.y1);
        const r = screenStillingBasins({ y1, v1: flows.map((f) => vFor(f.fr, f.y1)), tailwater: flows.map((f) => f.tw * f.y1 * belanger(f.fr)), family: family as StillingBasinInput['family'], maxSubmergence: 0.2, g });
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        for (const row of r.value.rows) expect(row.fits === 'yes').toBe(row.why.startsWith('inside'));
        if (r.value.margin !== null) expect((r.value.sweptOutCount ?? 0) > 0).toBe(r.value.margin < 0);
      }),
    );
  });

  it('Froude similarity: y1 × k and V1 × √k keep Fr1 and scale every length by k', () => {
    fc.assert(
      fc.property(flow, fc.double({ min: 0.1, max: 10, noNaN: true }), ({ y1, fr, tw }, k) => {
        const one = run({ y1: [y1], v1: [vFor(fr, y1)], tailwater: [tw * y1 * belanger(fr)] }).value;
        const two = run({ y1: [k * y1], v1: [vFor(fr, k * y1)], tailwater: [k * tw * y1 * belanger(fr)] }).value;
        expect(two.family).toBe(one.family === 'none' ? 'none' : two.family);
        expect(two.fr1).toBeCloseTo(one.fr1, 9);
        if (one.family === two.family && one.basinLength !== null) {
          expect(two.basinLength! / one.basinLength).toBeCloseTo(k, 9);
          expect(two.margin! / one.margin!).toBeCloseTo(k, 6);
        }
      }),
    );
  });
});

describe('details an engineer reads', () => {
  it('a Froude number just past a limit never reads as the limit', () => {
    expect(row(run({ y1: [0.5], v1: [vFor(4.501, 0.5)] }), 'USBR IV').why).toBe('Fr1 = 4.501 is above 4.5');
  });
  it('the SAF tailwater factor is held at the range ends, never negative (Blaisdell 1948 covers 1.7–17)', () => {
    expect(safTailwaterFactor(30)).toBe(safTailwaterFactor(17));
    expect(safTailwaterFactor(1.2)).toBe(safTailwaterFactor(1.7));
    expect(safTailwaterFactor(17)).toBeGreaterThan(0.6);
  });
  it('lists that do not line up are reported on the inflow line the block gave', () => {
    const r = screenStillingBasins({ ...base, y1: [0.3, 0.4, 0.5], v1: [10, 11], inflowField: 'discharges' });
    expect(!r.ok && r.error.field).toBe('discharges');
  });
  it('the oscillating warning names its flows', () => {
    const r = run({ y1: [0.5], v1: [vFor(3, 0.5), vFor(6, 0.5)], tailwater: [10], discharges: [30, 60] });
    expect(r.warnings.find((w) => w.code === 'oscillating-jump')!.message).toContain('At 1 of 2 flows 2.5 ≤ Fr1 < 4.5 (Q = 30 m³/s: Fr1 = 3)');
  });
  it('when no family is sized, the governing-flow figures are empty, not the first flow', () => {
    const v = run({ v1: [vFor(1.5, 0.5)] }).value;
    expect([v.governingY1, v.governingY2, v.tailwater, v.requiredTailwater, v.sweptOutCount]).toEqual([null, null, null, null, null]);
  });
  it('the tailwater factor shown is the governing flow\'s, so TW/y2 × y2g is the required tailwater', () => {
    const v = run({ y1: [0.3, 0.6], v1: [vFor(12, 0.3), vFor(6, 0.6)], tailwater: [1.5, 20], family: 'saf' }).value;
    expect(v.tailwaterFactor! * v.governingY2!).toBeCloseTo(v.requiredTailwater!, 12);
  });
});

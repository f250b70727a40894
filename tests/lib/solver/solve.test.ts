/**
 * `solve(kind, inputs)`: the uniform, spec-driven entry. Physical correctness is tested per
 * module; here the contract: validation messages name the field, defaults apply, outputs are
 * exactly the spec's, junk never throws.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { KIND_SPECS, SOLVER_KINDS, solve, solveHydraulicJump } from '@/lib/solver';

function errorOf(kind: string, inputs: unknown) {
  const r = solve(kind, inputs);
  if (r.ok) throw new Error('expected failure');
  return r.error;
}

describe('solve(kind, inputs) rejects bad calls without throwing', () => {
  it.each([null, undefined, 42, 'x', [], [1, 2]])('inputs %j → invalid-input', (inputs) => {
    expect(errorOf('hydraulic-jump', inputs).code).toBe('invalid-input');
  });

  it('names unknown kinds and lists the real ones', () => {
    const e = errorOf('hydraulic-jumpp', {});
    expect(e.code).toBe('unknown-kind');
    expect(e.message).toContain('hydraulic-jump');
  });

  it('names unknown inputs (typos)', () => {
    const e = errorOf('hydraulic-jump', { wdith: 3, discharge: 1, y1: 0.1 });
    expect(e).toMatchObject({ code: 'unknown-input', field: 'wdith' });
  });

  it.each([
    ['NaN', Number.NaN],
    ['Infinity', Infinity],
    ['negative', -1],
    ['zero', 0],
    ['a string', '3'],
    ['null', null],
  ])('rejects a %s width naming the field', (_, width) => {
    expect(errorOf('hydraulic-jump', { width, discharge: 1, y1: 0.1 })).toMatchObject({ code: 'invalid-input', field: 'width' });
  });

  it('requires fields that apply and have no default', () => {
    expect(errorOf('hydraulic-jump', { discharge: 1, y1: 0.1 })).toMatchObject({ code: 'missing-input', field: 'width' });
    expect(errorOf('hydraulic-jump', { shape: 'circular', discharge: 1, y1: 0.1 })).toMatchObject({ code: 'missing-input', field: 'diameter' });
  });

  it('requires exactly one option of each group', () => {
    expect(errorOf('hydraulic-jump', { width: 1, discharge: 1 })).toMatchObject({ code: 'missing-input' });
    expect(errorOf('hydraulic-jump', { width: 1, discharge: 1, y1: 0.1, y2: 1 })).toMatchObject({ code: 'conflicting-input' });
    expect(errorOf('hydraulic-jump', { width: 1, discharge: 1, unitDischarge: 1, y1: 0.1 })).toMatchObject({ code: 'conflicting-input' });
    expect(errorOf('tailwater-check', { width: 1, dischargeMin: 1, head: 5, tailwaterRating: { discharge: [0, 9], depth: [1, 2] } })).toMatchObject({ code: 'missing-input', field: 'dischargeMin', message: expect.stringMatching(/^Qmin needs Qmax \(largest discharge\) too: /) });
  });

  it('rejects a choice outside its list', () => {
    expect(errorOf('hydraulic-jump', { shape: 'oval', discharge: 1, y1: 0.1 })).toMatchObject({ code: 'invalid-input', field: 'shape' });
  });

  it('passes domain errors of the calculation through', () => {
    expect(errorOf('hydraulic-jump', { width: 1, discharge: 1, y1: 2 }).code).toBe('no-jump');
    expect(errorOf('surge', { shape: 'circular', depth: 1, direction: 'upstream', depthBehind: 2 }).code).toBe('unsupported-section');
  });
});

describe('solve(kind, inputs) results', () => {
  it('equals the typed function, with defaults for g and density', () => {
    const r = solve('hydraulic-jump', { shape: 'trapezoidal', width: 2, sideSlope: 1.5, discharge: 12, y1: 0.4 });
    const typed = solveHydraulicJump({ section: { shape: 'trapezoidal', width: 2, sideSlope: 1.5 }, discharge: 12, y1: 0.4 });
    expect(r.ok && typed.ok).toBe(true);
    if (r.ok && typed.ok) {
      expect(r.value.values['y2']).toBe(typed.value.y2);
      expect(r.value.values['power']).toBe(typed.value.power);
    }
  });

  it('accepts discharge per unit width in a rectangle (Q = q·b)', () => {
    const a = solve('hydraulic-jump', { width: 4, unitDischarge: 2.5, y1: 0.3 });
    const b = solve('hydraulic-jump', { width: 4, discharge: 10, y1: 0.3 });
    expect(a.ok && b.ok && a.value.values['y2'] === b.value.values['y2']).toBe(true);
  });

  it('warns about, and ignores, inputs that do not apply to the chosen shape', () => {
    const r = solve('hydraulic-jump', { width: 4, diameter: 2, discharge: 10, y1: 0.3 });
    expect(r.ok && r.warnings.map((w) => w.code)).toContain('unused-input');
  });

  const examples: Record<(typeof SOLVER_KINDS)[number], Record<string, unknown>> = {
    'hydraulic-jump': { width: 3, discharge: 15, y1: 0.5 },
    'toe-depth': { shape: 'trapezoidal', width: 5, sideSlope: 1, discharge: 40, head: 12, lossCoefficient: 0.1 },
    'sluice-gate': { width: 3, opening: 0.5, upstreamDepth: 4 },
    'tailwater-check': { width: 10, dischargeMin: 20, dischargeMax: 200, dischargeSteps: 10, head: 12, tailwaterRating: { discharge: [0, 250], depth: [0.5, 4] } },
    'stilling-basin': { y1: [0.5], velocities: [14], tailwater: [4.6] },
    surge: { depth: 2, velocity: 1.5, direction: 'upstream', dischargeChange: -3 },
    'dam-break': { upstreamDepth: 10, downstreamDepth: 2, time: 30 },
  };

  describe.each(SOLVER_KINDS)('kind %s', (kind) => {
    const spec = KIND_SPECS[kind];
    const r = solve(kind, examples[kind]);

    it('solves the example', () => {
      if (!r.ok) throw new Error(r.error.message);
      expect(r.value.kind).toBe(kind);
    });

    it('returns exactly the spec outputs, typed as declared', () => {
      if (!r.ok) return;
      expect(Object.keys(r.value.values)).toEqual(spec.outputs.map((o) => o.name));
      for (const o of spec.outputs) {
        const v = r.value.values[o.name];
        if (v === null) expect(o.nullable).toBe(true);
        else if (o.type === 'number') expect(Number.isFinite(v)).toBe(true);
        else expect(o.choices).toContain(v);
      }
    });

    it('returns table rows with exactly the spec columns', () => {
      if (!r.ok) return;
      if (spec.table === undefined) return expect(r.value.rows).toBeUndefined();
      expect(r.value.rows?.length).toBeGreaterThan(0);
      for (const row of r.value.rows ?? []) expect(Object.keys(row)).toEqual(spec.table.columns.map((c) => c.name));
    });

    it('never throws on junk inputs (fast-check)', () => {
      fc.assert(
        fc.property(fc.dictionary(fc.constantFrom(...spec.inputs.map((f) => f.name), 'junk'), fc.anything()), (inputs) => {
          expect(typeof solve(kind, inputs).ok).toBe('boolean');
        }),
        { numRuns: 150 },
      );
      fc.assert(
        fc.property(fc.anything(), (inputs) => {
          expect(typeof solve(kind, inputs).ok).toBe('boolean');
        }),
        { numRuns: 100 },
      );
    });

    it('never throws when numbers are perturbed to NaN, Infinity, 0, negative, huge or tiny', () => {
      const specials = [Number.NaN, Infinity, -Infinity, 0, -1, 1e308, 1e-308, Number.MIN_VALUE];
      for (const [key, value] of Object.entries(examples[kind])) {
        if (typeof value !== 'number') continue;
        for (const s of specials) expect(typeof solve(kind, { ...examples[kind], [key]: s }).ok).toBe('boolean');
      }
    });
  });
});

describe('SI and US customary inputs', () => {
  it('give the same physical answer for a trapezoidal jump (values converted by parseUnit/toSI)', async () => {
    const { parseUnit, toSI, fromSI } = await import('@/lib/solver');
    const unit = (s: string) => {
      const r = parseUnit(s);
      if (!r.ok) throw new Error(r.error.message);
      return r.value;
    };
    const us = solve('hydraulic-jump', {
      shape: 'trapezoidal',
      width: toSI(10, unit('ft')),
      sideSlope: 2,
      discharge: toSI(400, unit('cfs')),
      y1: toSI(1.2, unit('ft')),
      g: toSI(32.174, unit('ft/s2')),
    });
    const si = solve('hydraulic-jump', { shape: 'trapezoidal', width: 3.048, sideSlope: 2, discharge: 400 * 0.028316846592, y1: 1.2 * 0.3048, g: 32.174 * 0.3048 });
    if (!us.ok || !si.ok) throw new Error();
    expect(us.value.values['y2']).toBeCloseTo(si.value.values['y2'] as number, 12);
    // 32.174 ft/s² is standard gravity to 5 figures, so the result matches the default-g run.
    const std = solve('hydraulic-jump', { shape: 'trapezoidal', width: 3.048, sideSlope: 2, discharge: 400 * 0.028316846592, y1: 1.2 * 0.3048 });
    if (!std.ok) throw new Error();
    expect((us.value.values['y2'] as number) / (std.value.values['y2'] as number)).toBeCloseTo(1, 5);
    expect(fromSI(us.value.values['power'] as number, unit('hp'))).toBeGreaterThan(0);
  });
});

describe("solve('tailwater-check') with a separate downstream channel", () => {
  it('takes the normal depth in the channel section, not the basin section', async () => {
    const { normalDepth } = await import('@/lib/solver');
    const r = solve('tailwater-check', {
      width: 8,
      discharges: [60],
      toeMethod: 'gate',
      gateOpening: 0.5,
      tailwaterMethod: 'manning',
      manningN: 0.035,
      bedSlope: 0.0008,
      channelShape: 'trapezoidal',
      channelWidth: 6,
      channelSideSlope: 2,
    });
    if (!r.ok) throw new Error(r.error.message);
    const tw = normalDepth({ shape: 'trapezoidal', width: 6, sideSlope: 2 }, 60, 0.035, 0.0008);
    expect(r.value.rows?.[0]?.['tailwater']).toBeCloseTo(tw, 12);
  });

  it('ignores channel fields with a rating table, with a warning', () => {
    const r = solve('tailwater-check', { width: 8, discharges: [60], toeMethod: 'depth', y1: 0.4, tailwaterRating: { discharge: [0, 100], depth: [1, 4] }, channelShape: 'circular' });
    expect(r.ok && r.warnings.map((w) => w.code)).toContain('unused-input');
  });
});

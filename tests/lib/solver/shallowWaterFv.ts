/**
 * Independent test oracle: first-order finite-volume solver of the 1-D shallow-water
 * equations with the HLL flux (Harten, Lax and van Leer, 1983; wave-speed estimates of
 * Davis 1988; as set out in Toro, E. F., 2001, Shock-Capturing Methods for Free-Surface
 * Shallow Flows, ch. 10). Transmissive ends, horizontal frictionless bed.
 */
export interface FvState {
  readonly x: Float64Array;
  readonly h: Float64Array;
  readonly hu: Float64Array;
}

/** Runs a dam break (h0 for x < 0, h1 for x > 0, at rest) on [−L, L] with `cells` cells to time `t`. */
export function simulateDamBreak(h0: number, h1: number, L: number, cells: number, t: number, g: number): FvState {
  const dx = (2 * L) / cells;
  const x = new Float64Array(cells);
  const h = new Float64Array(cells);
  const hu = new Float64Array(cells);
  for (let i = 0; i < cells; i++) {
    x[i] = -L + (i + 0.5) * dx;
    h[i] = (x[i] as number) < 0 ? h0 : h1;
  }
  const fh = new Float64Array(cells + 1);
  const fm = new Float64Array(cells + 1);
  let time = 0;
  while (time < t) {
    let smax = 0;
    for (let i = 0; i < cells; i++) {
      const hi = h[i] as number;
      smax = Math.max(smax, Math.abs((hu[i] as number) / hi) + Math.sqrt(g * hi));
    }
    const dt = Math.min(0.9 * (dx / smax), t - time);
    for (let k = 0; k <= cells; k++) {
      const l = Math.max(0, k - 1);
      const r = Math.min(cells - 1, k);
      const hl = h[l] as number;
      const hr = h[r] as number;
      const ul = (hu[l] as number) / hl;
      const ur = (hu[r] as number) / hr;
      const cl = Math.sqrt(g * hl);
      const cr = Math.sqrt(g * hr);
      const sl = Math.min(ul - cl, ur - cr);
      const sr = Math.max(ul + cl, ur + cr);
      const flh = hl * ul;
      const frh = hr * ur;
      const flm = hl * ul * ul + 0.5 * g * hl * hl;
      const frm = hr * ur * ur + 0.5 * g * hr * hr;
      if (sl >= 0) {
        fh[k] = flh;
        fm[k] = flm;
      } else if (sr <= 0) {
        fh[k] = frh;
        fm[k] = frm;
      } else {
        fh[k] = (sr * flh - sl * frh + sl * sr * (hr - hl)) / (sr - sl);
        fm[k] = (sr * flm - sl * frm + sl * sr * (hr * ur - hl * ul)) / (sr - sl);
      }
    }
    for (let i = 0; i < cells; i++) {
      h[i] = (h[i] as number) - (dt / dx) * ((fh[i + 1] as number) - (fh[i] as number));
      hu[i] = (hu[i] as number) - (dt / dx) * ((fm[i + 1] as number) - (fm[i] as number));
    }
    time += dt;
  }
  return { x, h, hu };
}

/** Position where h first falls below `level` scanning from the right end, by linear interpolation. */
export function frontPosition(s: FvState, level: number): number {
  for (let i = s.h.length - 1; i > 0; i--) {
    const a = s.h[i - 1] as number;
    const b = s.h[i] as number;
    if (a >= level && b < level) {
      const xa = s.x[i - 1] as number;
      const xb = s.x[i] as number;
      return xa + ((a - level) / (a - b)) * (xb - xa);
    }
  }
  return Number.NaN;
}

/** Depth interpolated at `x`. */
export function depthAt(s: FvState, x: number): number {
  const dx = (s.x[1] as number) - (s.x[0] as number);
  const i = Math.min(s.x.length - 2, Math.max(0, Math.floor((x - (s.x[0] as number)) / dx)));
  const f = (x - (s.x[i] as number)) / dx;
  return (s.h[i] as number) * (1 - f) + (s.h[i + 1] as number) * f;
}

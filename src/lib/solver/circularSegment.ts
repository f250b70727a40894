/**
 * Circular segment (water in a partly full pipe) in terms of the half central angle
 * α = θ/2, cos α = 1 − 2y/D. Power series near α = 0 avoid cancellation at small depths.
 * Source: standard segment geometry, e.g. Chow, V. T., 1959, Open-Channel Hydraulics, Table 2-1.
 */

// A/r² = α − sin α cos α  =  Σ a_k α^(2k+3)
const AREA_SERIES = [
  2 / 3, -2 / 15, 4 / 315, -2 / 2835, 4 / 155925, -4 / 6081075, 8 / 638512875,
  -2 / 10854718875, 4 / 1856156927625,
];
// (A·ȳ)/r³ = sin α − sin³α / 3 − α cos α  =  Σ m_k α^(2k+5)
const MOMENT_SERIES = [
  2 / 15, -11 / 315, 17 / 3780, -461 / 1247400, 8303 / 389188800, -24911 / 27243216000,
  168151 / 5557616064000, -1513361 / 1900704693888000,
];
const SERIES_LIMIT = 0.5;

function horner(coefficients: readonly number[], x: number): number {
  let s = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) s = s * x + (coefficients[i] as number);
  return s;
}

/** Half central angle α (rad) for depth `y` in a pipe of diameter `d`: α = 2·asin(√(y/D)). */
export function circularHalfAngle(y: number, d: number): number {
  return 2 * Math.asin(Math.sqrt(Math.min(1, Math.max(0, y / d))));
}

/** Flow area A = r²(α − sin α cos α), m². */
export function circularArea(alpha: number, d: number): number {
  const r = 0.5 * d;
  if (alpha < SERIES_LIMIT) {
    const a2 = alpha * alpha;
    return r * r * alpha * a2 * horner(AREA_SERIES, a2);
  }
  return r * r * (alpha - Math.sin(alpha) * Math.cos(alpha));
}

/** First moment of area about the water surface A·ȳ = r³(sin α − sin³α/3 − α cos α), m³. */
export function circularFirstMoment(alpha: number, d: number): number {
  const r = 0.5 * d;
  if (alpha < SERIES_LIMIT) {
    const a2 = alpha * alpha;
    return r * r * r * a2 * a2 * alpha * horner(MOMENT_SERIES, a2);
  }
  const s = Math.sin(alpha);
  return r * r * r * (s - (s * s * s) / 3 - alpha * Math.cos(alpha));
}

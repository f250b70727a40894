/**
 * Closed-form geometry of the supported sections at depth y (m above the invert).
 * Source: Chow, V. T., 1959, Open-Channel Hydraulics, Table 2-1 (geometric elements).
 */
import { circularArea, circularFirstMoment, circularHalfAngle } from './circularSegment';
import type { Section } from './section';

/** Flow area A(y), m². Rect by; trap (b + zy)y; tri zy²; circle r²(α − sin α cos α). */
export function area(section: Section, y: number): number {
  switch (section.shape) {
    case 'rectangular':
      return section.width * y;
    case 'trapezoidal':
      return (section.width + section.sideSlope * y) * y;
    case 'triangular':
      return section.sideSlope * y * y;
    case 'circular':
      return circularArea(circularHalfAngle(y, section.diameter), section.diameter);
  }
}

/** Top (free-surface) width T(y), m. Rect b; trap b + 2zy; tri 2zy; circle D sin α (0 above the crown). */
export function topWidth(section: Section, y: number): number {
  switch (section.shape) {
    case 'rectangular':
      return section.width;
    case 'trapezoidal':
      return section.width + 2 * section.sideSlope * y;
    case 'triangular':
      return 2 * section.sideSlope * y;
    case 'circular': {
      const d = section.diameter;
      if (y >= d) return 0;
      return 2 * Math.sqrt(Math.max(0, y * (d - y)));
    }
  }
}

/** Wetted perimeter P(y), m. Rect b + 2y; trap b + 2y√(1+z²); tri 2y√(1+z²); circle D·α. */
export function wettedPerimeter(section: Section, y: number): number {
  switch (section.shape) {
    case 'rectangular':
      return section.width + 2 * y;
    case 'trapezoidal':
      return section.width + 2 * y * Math.sqrt(1 + section.sideSlope * section.sideSlope);
    case 'triangular':
      return 2 * y * Math.sqrt(1 + section.sideSlope * section.sideSlope);
    case 'circular':
      return section.diameter * circularHalfAngle(y, section.diameter);
  }
}

/**
 * First moment of the flow area about the free surface, A·ȳ (m³).
 * Rect by²/2; trap by²/2 + zy³/3; tri zy³/3; circle r³(sin α − sin³α/3 − α cos α).
 */
export function firstMoment(section: Section, y: number): number {
  switch (section.shape) {
    case 'rectangular':
      return 0.5 * section.width * y * y;
    case 'trapezoidal':
      return y * y * (0.5 * section.width + (section.sideSlope * y) / 3);
    case 'triangular':
      return (section.sideSlope * y * y * y) / 3;
    case 'circular':
      return circularFirstMoment(circularHalfAngle(y, section.diameter), section.diameter);
  }
}

/** Depth of the centroid below the free surface ȳ = (A·ȳ)/A, m. */
export function centroidDepth(section: Section, y: number): number {
  return firstMoment(section, y) / area(section, y);
}

/** Hydraulic depth A/T, m (`Infinity` for a full pipe). */
export function hydraulicDepth(section: Section, y: number): number {
  return area(section, y) / topWidth(section, y);
}

/** Hydraulic radius R = A/P, m. */
export function hydraulicRadius(section: Section, y: number): number {
  return area(section, y) / wettedPerimeter(section, y);
}

/** All geometric elements at one depth. */
export interface SectionProperties {
  /** Depth y, m. */
  readonly depth: number;
  /** Flow area A, m². */
  readonly area: number;
  /** Top width T, m. */
  readonly topWidth: number;
  /** Wetted perimeter P, m. */
  readonly wettedPerimeter: number;
  /** Hydraulic radius A/P, m. */
  readonly hydraulicRadius: number;
  /** Hydraulic depth A/T, m. */
  readonly hydraulicDepth: number;
  /** Centroid depth below the surface ȳ, m. */
  readonly centroidDepth: number;
  /** First moment A·ȳ, m³. */
  readonly firstMoment: number;
}

/** Computes every geometric element of `section` at depth `y`. */
export function sectionProperties(section: Section, y: number): SectionProperties {
  const a = area(section, y);
  const t = topWidth(section, y);
  const p = wettedPerimeter(section, y);
  const m = firstMoment(section, y);
  return {
    depth: y,
    area: a,
    topWidth: t,
    wettedPerimeter: p,
    hydraulicRadius: a / p,
    hydraulicDepth: a / t,
    centroidDepth: m / a,
    firstMoment: m,
  };
}

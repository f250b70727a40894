/**
 * Physical quantities that inputs and outputs carry, so values can be shown in any unit.
 */

/** Every quantity the solver reads or reports. `text` is a non-numeric choice or label. */
export const QUANTITIES = [
  'length',
  'area',
  'volume',
  'discharge',
  'unitDischarge',
  'velocity',
  'power',
  'acceleration',
  'density',
  'slope',
  'manningN',
  'time',
  'dimensionless',
  'text',
] as const;

/** One of {@link QUANTITIES}. */
export type Quantity = (typeof QUANTITIES)[number];

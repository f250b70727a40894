/**
 * Figures in messages, in the block's units: the solver works in SI, but an engineer who
 * writes `units = US` reads `short by 0.64 ft`, not `0.194 m`. Pure.
 */
import type { Quantity } from './quantity';
import { displayUnit, fromSI, type UnitSystem } from './units';

/** Says an SI value in the block's units: `18.4 m/s`, `60.4 ft/s` (3 significant figures unless asked). */
export type Say = ((valueSI: number, quantity: Quantity, significant?: number) => string) & {
  /** A limit the source gives in US units: `18.29 m/s (60 ft/s)` in SI, `60 ft/s` in US. */
  readonly limit: (valueSI: number, quantity: Quantity, source: string) => string;
};

/** `x` to `digits` significant figures, without trailing zeros: `4.5`, `0.713`, `46.45`. */
export const trimmed = (x: number, digits = 3): string => Number(x.toPrecision(digits)).toString();

/** A {@link Say} for `system`. */
export function sayIn(system: UnitSystem): Say {
  const say = (x: number, quantity: Quantity, significant = 3) => {
    const unit = displayUnit(quantity, system);
    return unit && unit.symbol !== '-' ? `${trimmed(fromSI(x, unit), significant)} ${unit.display}` : trimmed(x, significant);
  };
  return Object.assign(say, { limit: (x: number, quantity: Quantity, source: string) => (system === 'US' ? source : `${say(x, quantity, 4)} (${source})`) });
}

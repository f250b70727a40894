/**
 * Sequent's hydraulic solver: the only public import path (`@/lib/solver`).
 * Pure functions, SI units inside, results as `{ ok, value, warnings } | { ok: false, error }`.
 */
export { SOLVER_VERSION } from './version';
export type { SolverError, SolverFailure, SolverResult, SolverSuccess, Warning } from './result';
export { STANDARD_GRAVITY, WATER_DENSITY } from './constants';

// Uniform entry and the kind metadata contract.
export { solve, type SolveOptions } from './solve';
export { getKindSpec, isSolverKind, KIND_SPECS, SOLVER_KINDS, type SolverKind } from './kinds';
export type {
  FieldCondition,
  InputFieldSpec,
  InputFieldType,
  InputGroupSpec,
  InputValue,
  InputValues,
  KindSpec,
  OutputFieldSpec,
  OutputValue,
  SolveOutput,
  TableColumnSpec,
} from './kindSpec';

// Sections and open-channel functions.
export {
  SECTION_SHAPES,
  sectionFullDepth,
  validateSection,
  type CircularSection,
  type RectangularSection,
  type Section,
  type SectionShape,
  type TrapezoidalSection,
  type TriangularSection,
} from './section';
export {
  area,
  centroidDepth,
  firstMoment,
  hydraulicDepth,
  hydraulicRadius,
  sectionProperties,
  topWidth,
  wettedPerimeter,
  type SectionProperties,
} from './sectionGeometry';
export { froudeNumber, froudeSquared } from './froudeNumber';
export { specificEnergy } from './specificEnergy';
export { momentumFunction } from './momentumFunction';
export { criticalDepth } from './criticalDepth';
export { CIRCLE_MAX_CONVEYANCE_DEPTH_RATIO, manningDischarge, normalDepth } from './normalDepth';
export { belangerRatio } from './sequentDepth';

// Calculations.
export { JUMP_TYPE_BOUNDS, JUMP_TYPES, jumpType, type JumpType } from './jumpType';
export { JUMP_LENGTH_RANGE, ROLLER_LENGTH_RANGE } from './jumpLength';
export { PIPE_NEAR_CROWN_RATIO, solveHydraulicJump, type HydraulicJumpInput, type HydraulicJumpResult } from './hydraulicJump';
export {
  BREAKING_BORE_LIMIT,
  boreFront,
  solveSurge,
  UNDULAR_BORE_LIMIT,
  type BoreFront,
  type SurgeDirection,
  type SurgeInput,
  type SurgeResult,
} from './surge';
export { damBreakProfile, solveDamBreak, type DamBreakInput, type DamBreakResult } from './damBreak';
export { maxDischargeForHead, solveToeDepth, type ToeDepthInput, type ToeDepthResult } from './toeDepth';
export {
  CONTRACTION_COEFFICIENT_RANGE,
  DEFAULT_CONTRACTION_COEFFICIENT,
  solveSluiceGate,
  type SluiceGateInput,
  type SluiceGateResult,
} from './sluiceGate';
export { interpolateRating, validateRatingTable, type RatingTable } from './tailwaterRating';
export { ratingDepths } from './tailwaterCheckKind';
export {
  DEFAULT_TOE_TOLERANCE,
  dischargeRange,
  MAX_FLOWS,
  solveTailwaterCheck,
  type JumpPosition,
  type TailwaterCheckInput,
  type TailwaterCheckResult,
  type TailwaterRow,
  type TailwaterSource,
  type ToeMethod,
} from './tailwaterCheck';
export { BASIN_FAMILIES, BASIN_LIMITS, FAMILIES, safTailwaterFactor, type BasinElements, type BasinFamily, type BasinFamilyId, type ToeFlow } from './basinFamilies';
export { DEFAULT_MAX_SUBMERGENCE, MAX_BASIN_FLOWS, screenStillingBasins, type FamilyScreening, type StillingBasinInput, type StillingBasinResult } from './stillingBasin';

// Units and formatting.
export { QUANTITIES, type Quantity } from './quantity';
export { displayUnit, fromSI, parseUnit, toSI, UNIT_SYSTEMS, UNITS, unitsFor, type UnitDefinition, type UnitSystem } from './units';
export { DEFAULT_SIGNIFICANT, formatNumber, formatQuantity } from './formatValue';

/**
 * Version of the solver's numerical behaviour. Approval snapshots record it, so it must
 * change (semver: patch for fixes that change digits, minor for new outputs, major for
 * changed meanings) whenever any result can change.
 */
export const SOLVER_VERSION = '1.1.0';

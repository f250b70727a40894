/**
 * The caution every result screen and export carries. One wording, used everywhere.
 */
export const DESIGN_AID_CAUTION =
  'Results are design aids. They must be checked by a licensed engineer against the codes that apply locally, ' +
  'and major structures need physical model studies.';

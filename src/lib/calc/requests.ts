import { z } from 'zod';
import { MAX_LIST_LENGTH } from './resolveInputs';

/** One input value as JSON (see {@link import('./solveJson').JsonInput}). */
export const JsonInputSchema = z.union([
  z.number(),
  z.string().max(500),
  z.object({ value: z.number(), unit: z.string().max(40) }).strict(),
  z.array(z.union([z.number(), z.string().max(100)])).max(MAX_LIST_LENGTH),
  z.object({ header: z.array(z.string().max(60)).min(1).max(10), rows: z.array(z.array(z.number()).max(10)).max(MAX_LIST_LENGTH) }).strict(),
]);

/** `POST /api/v1/solve` and `npm run solve`: one calculation. */
export const SolveRequestSchema = z
  .object({
    /** A calculation word (`jump`) or solver kind id (`hydraulic-jump`). */
    kind: z.string().min(1).max(40),
    /** Inputs keyed by field name or symbol, e.g. `{ "b": "12 m", "Q": 85, "y1": {"value": 2, "unit": "ft"} }`. */
    inputs: z.record(z.string().min(1).max(40), JsonInputSchema),
    /** Unit system of numbers written without a unit, and of the results. */
    units: z.enum(['SI', 'US']).default('SI'),
  })
  .strict();

/** `POST /api/v1/evaluate`: a whole case body. */
export const EvaluateRequestSchema = z
  .object({
    markdown: z.string().max(200_000, 'A case body may have at most 200,000 characters.'),
    /** A case of the caller's firm whose attached files (of the revision being worked on) blocks may read. */
    caseId: z.uuid('caseId must be a case id.').optional(),
  })
  .strict();

export type SolveRequest = z.output<typeof SolveRequestSchema>;

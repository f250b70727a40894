/**
 * The precedent-search query the API accepts, checked once at the boundary. The route
 * reads the query string with `queryFromParams` (./params) and validates the result here.
 */
import { z } from 'zod';
import { SECTION_SHAPES, STRUCTURE_TYPES } from '../cases/validation';
import { SOLVER_KINDS } from '../solver';
import { SEARCH_SORTS } from './params';

/** Longest search text accepted. */
export const MAX_QUERY_LENGTH = 200;
/** Largest Fr₁ the range control accepts (well past any jump a structure is designed for). */
export const MAX_FROUDE = 100;
/** Deepest page served (20 results each): past it, narrow the search. */
export const MAX_PAGE = 50;

const bound = (what: string, max: number) =>
  z
    .number({ error: `${what} must be a number.` })
    .refine((v) => v >= 0, `${what} cannot be negative.`)
    .refine((v) => v <= max, `${what} must be at most ${max}.`)
    .nullable();

const values = <T extends readonly [string, ...string[]]>(what: string, allowed: T) =>
  z.array(z.enum(allowed, { error: `Unknown ${what}: choose from ${allowed.join(', ')}.` })).max(allowed.length);

const words = (what: string) =>
  z.array(z.string().max(80, `Keep each ${what} to 80 characters or fewer.`)).max(20, `Choose at most 20 ${what}s.`);

/** A validated precedent search. */
export const PrecedentQuerySchema = z
  .object({
    q: z.string().max(MAX_QUERY_LENGTH, `Keep the search text to ${MAX_QUERY_LENGTH} characters or fewer.`),
    frMin: bound('The lowest Fr₁', MAX_FROUDE),
    frMax: bound('The highest Fr₁', MAX_FROUDE),
    dischargeMin: bound('The lowest discharge', 1e6),
    dischargeMax: bound('The highest discharge', 1e6),
    facets: z.object({
      structure: values('structure type', STRUCTURE_TYPES),
      shape: values('section shape', SECTION_SHAPES),
      kind: values('calculation kind', SOLVER_KINDS),
      region: words('region'),
      tag: words('tag'),
    }),
    sort: z.enum(SEARCH_SORTS),
    page: z.number().int().min(1).max(MAX_PAGE, `Pages stop at ${MAX_PAGE}: narrow the search to see more.`),
  })
  .refine((q) => q.frMin === null || q.frMax === null || q.frMin <= q.frMax, {
    message: 'The lowest Fr₁ must not be above the highest.',
    path: ['frMin'],
  })
  .refine((q) => q.dischargeMin === null || q.dischargeMax === null || q.dischargeMin <= q.dischargeMax, {
    message: 'The lowest discharge must not be above the highest.',
    path: ['dischargeMin'],
  });

/** A precedent search after validation. */
export type ValidPrecedentQuery = z.output<typeof PrecedentQuerySchema>;

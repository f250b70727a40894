/**
 * Input schemas for cases, shared by the API routes, the pages and the editor island.
 * Pure: imports nothing but zod and ./states, so the browser can use it as it is.
 */
import { z } from 'zod';
import { CASE_STATES } from './states';

/** Kinds of structure or situation a case is about. */
export const STRUCTURE_TYPES = [
  'spillway-basin',
  'chute-outlet',
  'culvert-outlet',
  'outfall',
  'drop-structure',
  'gate-tailwater',
  'weir-tailwater',
  'canal-surge',
  'tidal-bore',
  'dam-break',
  'other',
] as const;

/** Channel sections a case is about (`mixed` when it changes along the structure). */
export const SECTION_SHAPES = ['rectangular', 'trapezoidal', 'triangular', 'circular', 'mixed'] as const;

/** A structure type. */
export type StructureType = (typeof STRUCTURE_TYPES)[number];

/** A section shape of a case. */
export type CaseSectionShape = (typeof SECTION_SHAPES)[number];

/** How the product names each structure type. */
export const STRUCTURE_TYPE_LABELS: Record<StructureType, string> = {
  'spillway-basin': 'Spillway stilling basin',
  'chute-outlet': 'Chute outlet',
  'culvert-outlet': 'Culvert outlet',
  outfall: 'Outfall',
  'drop-structure': 'Drop structure',
  'gate-tailwater': 'Gate tailwater',
  'weir-tailwater': 'Weir tailwater',
  'canal-surge': 'Canal surge',
  'tidal-bore': 'Tidal bore',
  'dam-break': 'Dam-break front',
  other: 'Other',
};

/** How the product names each section shape. */
export const SECTION_SHAPE_LABELS: Record<CaseSectionShape, string> = {
  rectangular: 'Rectangular',
  trapezoidal: 'Trapezoidal',
  triangular: 'Triangular',
  circular: 'Circular (part full)',
  mixed: 'Mixed',
};

/** Longest case body accepted, in characters. */
export const MAX_BODY_LENGTH = 200_000;

/** Longest summary accepted, in characters. */
export const MAX_SUMMARY_LENGTH = 400;

/** Most tags a case may carry. */
export const MAX_TAGS = 12;

const BodySchema = z
  .string({ error: 'The body must be text (markdown).' })
  .max(MAX_BODY_LENGTH, 'A case body may have at most 200,000 characters. Split very long cases into two.');

/** An optional short text: blank means none (null); absent means "not given". */
const optionalText = (max: number, what: string) =>
  z
    .string({ error: `The ${what} must be text.` })
    .trim()
    .max(max, `Keep the ${what} to ${max} characters or fewer.`)
    .transform((value) => value || null)
    .nullish();

const TagSchema = z
  .string({ error: 'Each tag must be text.' })
  .trim()
  .toLowerCase()
  .transform((tag) => tag.replace(/\s+/g, ' '))
  .pipe(z.string().min(1, 'A tag cannot be empty.').max(32, 'Keep each tag to 32 characters or fewer.'));

const metadataShape = {
  /** What the case is, as it appears in lists and on the calculation sheet. */
  title: z
    .string({ error: 'Give the case a title.' })
    .trim()
    .min(3, 'Give the case a title of at least 3 characters.')
    .max(160, 'Keep the title to 160 characters or fewer.'),
  /** The structure or situation the case is about. */
  structureType: z.enum(STRUCTURE_TYPES, { error: `Choose a structure type: ${STRUCTURE_TYPES.join(', ')}.` }),
  /** The channel section the case is about. */
  sectionShape: z.enum(SECTION_SHAPES, { error: `Choose a section shape: ${SECTION_SHAPES.join(', ')}.` }),
  /** The firm's project number or name, if any (blank for none). */
  projectReference: optionalText(60, 'project reference'),
  /** One or two sentences on what the case found, shown in search results (blank for none). */
  summary: optionalText(MAX_SUMMARY_LENGTH, 'summary'),
  /** Where the structure is (river, catchment, country), if worth saying (blank for none). */
  region: optionalText(80, 'region'),
  /** Free keywords, lower-cased, duplicates dropped. */
  tags: z
    .array(TagSchema, { error: 'Tags must be a list of words.' })
    .max(100, `A case can have at most ${MAX_TAGS} tags.`)
    .transform((tags) => [...new Set(tags)])
    .pipe(z.array(z.string()).max(MAX_TAGS, `A case can have at most ${MAX_TAGS} tags.`)),
};

/** A case's metadata (everything but the body). */
export const CaseMetadataSchema = z.strictObject({ ...metadataShape, tags: metadataShape.tags.default([]) });

/** A case's metadata after validation. */
export type CaseMetadata = z.output<typeof CaseMetadataSchema>;

/** `POST /api/v1/cases`: metadata and, optionally, the first body. */
export const CreateCaseSchema = z.strictObject({
  ...CaseMetadataSchema.shape,
  /** Markdown with calculation blocks; empty when left out. */
  body: BodySchema.default(''),
});

/** A validated new case. */
export type CreateCaseRequest = z.output<typeof CreateCaseSchema>;

/** Metadata fields to change on a save; fields left out stay as they are. */
export const CaseMetadataPatchSchema = z.strictObject(metadataShape).partial();

/** A validated metadata change. */
export type CaseMetadataPatch = z.output<typeof CaseMetadataPatchSchema>;

/** `PATCH /api/v1/cases/:id`: a save from the editor. */
export const SaveCaseSchema = z
  .strictObject({
    /** The revision number the editor started from; a save on a stale one is refused. */
    baseRevision: z
      .number({ error: 'baseRevision must be the revision number you started editing from.' })
      .int('baseRevision must be a whole number.')
      .min(0, 'baseRevision cannot be negative.'),
    /** The whole new body. */
    body: BodySchema.optional(),
    metadata: CaseMetadataPatchSchema.optional(),
  })
  .refine((save) => save.body !== undefined || save.metadata !== undefined, {
    message: 'Send a new body, metadata to change, or both.',
    path: ['body'],
  });

/** A validated save. */
export type SaveCaseRequest = z.output<typeof SaveCaseSchema>;

/** How a list of cases can be ordered. */
export const CASE_SORTS = ['updated', 'title', 'fr1'] as const;

/** `GET /api/v1/cases` query parameters. */
export const ListCasesQuerySchema = z.object({
  /** `1` (or `true`) for the caller's own cases only. */
  mine: z
    .enum(['1', '0', 'true', 'false'], { error: 'mine must be 1 or 0.' })
    .optional()
    .transform((v) => v === '1' || v === 'true'),
  /** A case state, e.g. `draft`. */
  state: z.enum(CASE_STATES, { error: `state must be one of ${CASE_STATES.join(', ')}.` }).optional(),
  /** updated (default, newest first), title (A–Z) or fr1 (largest Fr1 of the latest revision). */
  sort: z.enum(CASE_SORTS, { error: 'sort must be updated, title or fr1.' }).default('updated'),
  /** asc or desc; the default suits the sort (updated: desc, title: asc, fr1: desc). */
  dir: z.enum(['asc', 'desc'], { error: 'dir must be asc or desc.' }).optional(),
  limit: z.coerce
    .number({ error: 'limit must be a number.' })
    .int('limit must be a whole number.')
    .min(1, 'limit must be at least 1.')
    .max(100, 'limit can be at most 100.')
    .default(50),
  offset: z.coerce
    .number({ error: 'offset must be a number.' })
    .int('offset must be a whole number.')
    .min(0, 'offset cannot be negative.')
    .default(0),
});

/** Validated list parameters. */
export type ListCasesQuery = z.output<typeof ListCasesQuerySchema>;

/** `GET /api/v1/cases/:id/diff` query parameters. */
export const DiffQuerySchema = z.object({
  from: z.coerce.number({ error: 'from must be a revision number.' }).int('from must be a whole number.').min(1, 'from must be at least 1.'),
  to: z.coerce.number({ error: 'to must be a revision number.' }).int('to must be a whole number.').min(1, 'to must be at least 1.'),
});

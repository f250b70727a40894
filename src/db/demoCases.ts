/**
 * The demo cases in content/cases/*.md (invented scenario): frontmatter with the case's
 * metadata and its author's e-mail, then the markdown body. Read by the seed script.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** One demo case file. */
export interface DemoCase {
  file: string;
  authorEmail: string;
  metadata: {
    title: string;
    structureType: string;
    sectionShape: string;
    projectReference?: string;
    summary?: string;
    region?: string;
    tags: string[];
  };
  body: string;
  /** Where the seed leaves the case in review (absent: a draft). */
  review?: DemoReview;
}

/** A demo case's review, as the frontmatter's `review`, `reviewer` and `reviewComment` say. */
export interface DemoReview {
  state: 'in_review' | 'returned' | 'published';
  /** The reviewer asked for, who returns or approves it (absent: the firm's pool, in review). */
  reviewerEmail?: string;
  /** The comments of a return. */
  comment?: string;
}

const REVIEW_STATES = ['in_review', 'returned', 'published'] as const;

export const demoCasesFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../content/cases');

/** Splits `---` frontmatter (flat `key: value` lines, `[a, b]` lists) from the body. */
export function parseDemoCase(file: string, text: string): DemoCase {
  const match = /^---\r?\n([\s\S]*?)\r?\n---\r?\n?([\s\S]*)$/.exec(text);
  if (!match) throw new Error(`${file}: no frontmatter`);
  const fields: Record<string, string> = {};
  for (const line of match[1]!.split(/\r?\n/)) {
    const m = /^([A-Za-z]+):\s*(.*)$/.exec(line);
    if (m) fields[m[1]!] = m[2]!.trim().replace(/^"(.*)"$/, '$1');
  }
  const need = (key: string) => {
    if (!fields[key]) throw new Error(`${file}: frontmatter needs ${key}`);
    return fields[key]!;
  };
  const tags = (fields.tags ?? '').replace(/^\[|\]$/g, '').split(',').map((t) => t.trim()).filter(Boolean);
  return {
    file,
    authorEmail: need('author'),
    metadata: {
      title: need('title'),
      structureType: need('structureType'),
      sectionShape: need('sectionShape'),
      ...(fields.projectReference ? { projectReference: fields.projectReference } : {}),
      ...(fields.summary ? { summary: fields.summary } : {}),
      ...(fields.region ? { region: fields.region } : {}),
      tags,
    },
    body: match[2]!.replace(/^\s+/, ''),
    ...(fields.review ? { review: demoReview(file, fields) } : {}),
  };
}

function demoReview(file: string, fields: Record<string, string>): DemoReview {
  const state = REVIEW_STATES.find((s) => s === fields.review);
  if (!state) throw new Error(`${file}: review must be one of ${REVIEW_STATES.join(', ')}`);
  if (state !== 'in_review' && !fields.reviewer) throw new Error(`${file}: a ${state} case needs a reviewer`);
  if (state === 'returned' && !fields.reviewComment) throw new Error(`${file}: a returned case needs reviewComment`);
  return { state, ...(fields.reviewer ? { reviewerEmail: fields.reviewer } : {}), ...(fields.reviewComment ? { comment: fields.reviewComment } : {}) };
}

/** Every demo case, in file-name order. */
export function readDemoCases(folder = demoCasesFolder): DemoCase[] {
  return readdirSync(folder)
    .filter((f) => f.endsWith('.md'))
    .sort()
    .map((f) => parseDemoCase(f, readFileSync(path.join(folder, f), 'utf8')));
}

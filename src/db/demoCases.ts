/**
 * The demo cases in content/cases/*.md (invented scenario): frontmatter with the case's
 * metadata and its author's e-mail, then the markdown body. Read by the seed script.
 * Files a case carries are named by its `attachments: [a.csv, b.png]` line; they live in
 * content/cases/files/, with their captions in content/cases/files/captions.json.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
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
  /** Files the seed attaches to the first revision, before any review (so a published revision keeps them). */
  attachments: DemoAttachment[];
}

/** A demo file in content/cases/files/ and its caption. */
export interface DemoAttachment {
  fileName: string;
  caption: string;
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

/** The subfolder of the demo cases' files (not markdown, so never read as a case). */
export const DEMO_FILES_SUBFOLDER = 'files';

/** Captions of the demo files, by file name (`files/captions.json`). */
export type DemoCaptions = Readonly<Record<string, string>>;

/** Splits `---` frontmatter (flat `key: value` lines, `[a, b]` lists) from the body. */
export function parseDemoCase(file: string, text: string, captions: DemoCaptions = {}): DemoCase {
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
  const list = (value: string | undefined) => (value ?? '').replace(/^\[|\]$/g, '').split(',').map((t) => t.trim()).filter(Boolean);
  const tags = list(fields.tags);
  const attachments = list(fields.attachments).map((fileName) => {
    if (!/^[A-Za-z0-9][A-Za-z0-9._-]*$/.test(fileName)) throw new Error(`${file}: attachment ${fileName} must be a plain file name in ${DEMO_FILES_SUBFOLDER}/`);
    return { fileName, caption: captions[fileName] ?? '' };
  });
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
    attachments,
  };
}

function demoReview(file: string, fields: Record<string, string>): DemoReview {
  const state = REVIEW_STATES.find((s) => s === fields.review);
  if (!state) throw new Error(`${file}: review must be one of ${REVIEW_STATES.join(', ')}`);
  if (state !== 'in_review' && !fields.reviewer) throw new Error(`${file}: a ${state} case needs a reviewer`);
  if (state === 'returned' && !fields.reviewComment) throw new Error(`${file}: a returned case needs reviewComment`);
  return { state, ...(fields.reviewer ? { reviewerEmail: fields.reviewer } : {}), ...(fields.reviewComment ? { comment: fields.reviewComment } : {}) };
}

/** Every demo case, in file-name order (only `*.md` files of the folder itself). */
export function readDemoCases(folder = demoCasesFolder): DemoCase[] {
  const captionsFile = path.join(folder, DEMO_FILES_SUBFOLDER, 'captions.json');
  const captions: DemoCaptions = existsSync(captionsFile) ? JSON.parse(readFileSync(captionsFile, 'utf8')) : {};
  return readdirSync(folder)
    .filter((f) => f.endsWith('.md'))
    .sort()
    .map((f) => parseDemoCase(f, readFileSync(path.join(folder, f), 'utf8'), captions));
}

/** The bytes of a demo file named by a case's `attachments` line. */
export function readDemoFile(fileName: string, folder = demoCasesFolder): Uint8Array {
  const where = path.join(folder, DEMO_FILES_SUBFOLDER, fileName);
  if (!existsSync(where)) throw new Error(`demo file ${DEMO_FILES_SUBFOLDER}/${fileName} is missing`);
  return new Uint8Array(readFileSync(where));
}

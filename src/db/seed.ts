/**
 * Demo data: two fictional firms, so that firm isolation can be seen. Every name, firm
 * and address here is invented (the `.example` domain is reserved for examples).
 * Safe to run again: existing firms and people are left as they are.
 */
import { and, eq } from 'drizzle-orm';
import { addAttachments, CaptionSchema, checkUpload } from '../lib/attachments';
import type { Role } from '../lib/auth/roles';
import { createCase } from '../lib/cases/create';
import { CaseMetadataSchema } from '../lib/cases/validation';
import { addMember, ensureFirm, type HashPassword } from '../lib/firms';
import type { Database } from './client';
import { readDemoCases, readDemoFile, type DemoCase } from './demoCases';
import { actOnCase, type ReviewRequest } from '../lib/review';
import { fileStore } from '../lib/storage';
import { caseFile, user } from './schema';

/** The shared password of every demo account (printed by `npm start`, listed in the README). */
export const DEMO_PASSWORD = 'sequent-demo';

export interface DemoAccount {
  name: string;
  email: string;
  role: Role;
}

export interface DemoFirm {
  name: string;
  slug: string;
  people: DemoAccount[];
}

export const DEMO_FIRMS: DemoFirm[] = [
  {
    name: 'Kestrel Weir Consulting',
    slug: 'kestrel-weir',
    people: [
      { name: 'Maren Castell', email: 'maren.castell@kestrelweir.example', role: 'admin' },
      { name: 'Tomas Ilvar', email: 'tomas.ilvar@kestrelweir.example', role: 'engineer' },
      { name: 'Priya Odunya', email: 'priya.odunya@kestrelweir.example', role: 'engineer' },
      { name: 'Helena Brandt', email: 'helena.brandt@kestrelweir.example', role: 'reviewer' },
      { name: 'Josef Warrick', email: 'josef.warrick@kestrelweir.example', role: 'reviewer' },
    ],
  },
  {
    name: 'Brightwater Ridge Engineers',
    slug: 'brightwater-ridge',
    people: [
      { name: 'Rowan Fairlie', email: 'rowan.fairlie@brightwater.example', role: 'admin' },
      { name: 'Ada Quillon', email: 'ada.quillon@brightwater.example', role: 'engineer' },
    ],
  },
];

/** What a seed run added. */
export interface SeedReport {
  people: number;
  cases: number;
}

/**
 * Attaches a demo case's files (content/cases/files/) to its first revision, as its author
 * would upload them: the same checks (`checkUpload`) and service, one file per call so each
 * keeps its own caption. Runs before the review, so a published revision shows them.
 */
async function seedAttachments(database: Database, firmId: string, caseId: string, authorId: string, demo: DemoCase): Promise<void> {
  for (const { fileName, caption } of demo.attachments) {
    const checked = await checkUpload(fileName, readDemoFile(fileName));
    if (!checked.ok) throw new Error(`${demo.file}: ${checked.refused.message}`);
    const added = await addAttachments(database, fileStore(), { firmId, caseId, userId: authorId, files: [checked.file], caption: CaptionSchema.parse(caption) });
    if (!added.ok) throw new Error(`${demo.file}: attaching ${fileName} refused (${added.reason})`);
  }
}

/** Takes a demo case through review as its frontmatter says, with the real transitions. */
async function seedReview(database: Database, firmId: string, caseId: string, authorId: string, demo: DemoCase): Promise<void> {
  const review = demo.review!;
  const reviewer = review.reviewerEmail ? (await database.select({ id: user.id }).from(user).where(eq(user.email, review.reviewerEmail)))[0] : undefined;
  if (review.reviewerEmail && !reviewer) throw new Error(`${demo.file}: no demo account ${review.reviewerEmail}`);
  const act = async (request: Omit<ReviewRequest, 'firmId' | 'caseId'>) => {
    const result = await actOnCase(database, { firmId, caseId, ...request });
    if (!result.ok) throw new Error(`${demo.file}: ${request.action} refused: ${result.message}`);
  };
  await act({ actor: { userId: authorId, role: 'engineer' }, action: 'submit', ...(reviewer ? { reviewerIds: [reviewer.id] } : {}) });
  if (!reviewer || review.state === 'in_review') return;
  if (review.state === 'returned') await act({ actor: { userId: reviewer.id, role: 'reviewer' }, action: 'return', reason: review.comment! });
  else await act({ actor: { userId: reviewer.id, role: 'reviewer' }, action: 'approve' });
}

/**
 * Creates the demo firms, people and cases that do not exist yet (cases are matched by
 * title within the first demo firm, so edits made in the demo are kept). A new case gets
 * its demo files; a case that exists is never given them again.
 */
export async function seedDemo(database: Database, hashPassword: HashPassword): Promise<SeedReport> {
  let added = 0;
  let cases = 0;
  let firstFirmId: string | null = null;
  for (const demo of DEMO_FIRMS) {
    const firm = await ensureFirm(database, { name: demo.name, slug: demo.slug });
    firstFirmId ??= firm.id;
    for (const person of demo.people) {
      const result = await addMember(database, hashPassword, {
        ...person,
        firmId: firm.id,
        temporaryPassword: DEMO_PASSWORD,
        actorUserId: null,
      });
      if (result.ok) added += 1;
    }
  }
  if (firstFirmId) {
    for (const demo of readDemoCases()) {
      const [exists] = await database
        .select({ id: caseFile.id, summary: caseFile.summary })
        .from(caseFile)
        .where(and(eq(caseFile.firmId, firstFirmId), eq(caseFile.title, demo.metadata.title)));
      if (exists) {
        // Databases seeded before cases had summaries get them; nothing else is touched.
        if (exists.summary === null && demo.metadata.summary) {
          await database.update(caseFile).set({ summary: demo.metadata.summary }).where(eq(caseFile.id, exists.id));
        }
        continue;
      }
      const [author] = await database.select({ id: user.id }).from(user).where(eq(user.email, demo.authorEmail));
      if (!author) throw new Error(`${demo.file}: no demo account ${demo.authorEmail}`);
      const metadata = CaseMetadataSchema.parse(demo.metadata);
      const created = await createCase(database, { firmId: firstFirmId, authorId: author.id, metadata, body: demo.body });
      await seedAttachments(database, firstFirmId, created.id, author.id, demo);
      if (demo.review) await seedReview(database, firstFirmId, created.id, author.id, demo);
      cases += 1;
    }
  }
  return { people: added, cases };
}

/**
 * The method notes the blocks of a case rely on (each block's `methodNote` slug →
 * content/methods/<slug>.md), in the order the blocks first use them, with their titles
 * and the sources they cite.
 */
import { getEntry } from 'astro:content';
import type { CaseEvaluation } from '../../lib/calc/results';
import type { MethodUsed } from '../../lib/sheet';

/** Method notes used by `evaluation`; a slug without a note is listed by its slug alone. */
export async function methodsUsed(evaluation: CaseEvaluation): Promise<MethodUsed[]> {
  const slugs = [...new Set(evaluation.blocks.map((b) => b.methodNote).filter((s) => s !== ''))];
  return Promise.all(
    slugs.map(async (slug) => {
      const note = await getEntry('methods', slug);
      return note ? { slug, title: note.data.title, sources: note.data.sources } : { slug, title: slug, sources: [] };
    }),
  );
}

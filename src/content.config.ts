import { glob } from 'astro/loaders';
import { defineCollection, z } from 'astro:content';

/** One method note per calculation kind: equations, assumptions, validity range, sources. */
const methods = defineCollection({
  loader: glob({ pattern: '*.md', base: './content/methods' }),
  schema: z.object({
    title: z.string(),
    /** The solver kind id the note documents, e.g. `hydraulic-jump`. */
    kind: z.string(),
    summary: z.string(),
    sources: z.array(z.string()).min(1),
  }),
});

/** Guides for authors (the block syntax). */
const guide = defineCollection({
  loader: glob({ pattern: '*.md', base: './content/guide' }),
  schema: z.object({ title: z.string(), summary: z.string() }),
});

export const collections = { methods, guide };

/**
 * The allow-list that case markdown is sanitised against, after remark-rehype and before
 * KaTeX. Based on GitHub's (hast-util-sanitize's `defaultSchema`), narrowed and widened on
 * purpose:
 * - kept: GFM tables (and their `align`), task lists, footnotes, `language-*` code classes,
 *   the `math-inline` / `math-display` classes remark-math puts on math code;
 * - dropped: every element not listed (so `script`, `style`, `iframe`, `object`, `embed`,
 *   `form`, `svg`, `math`…), every attribute not listed (so `on*` handlers and `style`),
 *   and any URL whose scheme is not http(s)/mailto (so `javascript:`, `vbscript:`, `data:`).
 * Raw HTML never reaches it (remark-rehype runs with `allowDangerousHtml: false`); the
 * schema is the second wall, for whatever the markdown syntax itself can produce.
 */
import { defaultSchema } from 'rehype-sanitize';

type Schema = typeof defaultSchema;
type AttributeList = NonNullable<Schema['attributes']>[string];

/** Elements no case ever needs, even though GitHub's list allows them. */
const DROPPED_TAGS = new Set(['input', 'picture', 'source', 'details', 'summary']);

const base = defaultSchema.attributes ?? {};

/** Generic attributes of the default list that are still useful in a case body. */
const GLOBAL_ATTRIBUTES: AttributeList = ['align', 'alt', 'colSpan', 'rowSpan', 'scope', 'title', 'id', 'ariaHidden', 'ariaLabel', 'ariaDescribedBy', 'ariaLabelledBy', 'dir', 'lang', 'start'];

/** Schema for `rehype-sanitize`; see the module comment. */
export const CASE_SANITIZE_SCHEMA: Schema = {
  ...defaultSchema,
  tagNames: [...(defaultSchema.tagNames ?? []).filter((t) => !DROPPED_TAGS.has(t)), 'input'],
  attributes: {
    ...base,
    '*': GLOBAL_ATTRIBUTES,
    // Tasks lists render checkboxes; only disabled checkboxes pass (`required` below).
    input: [['disabled', true], ['type', 'checkbox'], 'checked'],
    code: [['className', /^language-[\w-]+$/, 'math-inline', 'math-display']],
    img: ['src', 'alt', 'title'],
    a: [...(base['a'] ?? []), 'title'],
  },
  protocols: {
    href: ['http', 'https', 'mailto'],
    src: ['http', 'https'],
    cite: ['http', 'https'],
    longDesc: ['http', 'https'],
  },
  // remark-rehype already prefixes footnote ids with `user-content-`: prefixing again would
  // break the footnote links. No other source of ids or names reaches this step.
  clobber: [],
  strip: ['script', 'style'],
};

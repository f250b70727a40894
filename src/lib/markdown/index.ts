/**
 * Case markdown: the shared, sanitised rendering pipeline (`@/lib/markdown`).
 */
export { renderCase, renderMarkdown, type RenderedCase } from './renderCase';
export { MATH_ERROR_COLOR } from './renderMath';
export { CASE_SANITIZE_SCHEMA } from './sanitizeSchema';
export { slugify } from './headingIds';
export { escapeHtml } from './escapeHtml';
export type { CaseSegment } from './splitSegments';
export { plainText } from './plainText';

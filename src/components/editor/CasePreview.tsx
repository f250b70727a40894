import { useMemo } from 'react';
import { NO_FILES, type BlockFiles } from '../../lib/calc/files';
import { renderCase } from '../../lib/markdown/renderCase';
import { BlockChart } from '../blocks/BlockChart';
import { BlockResults } from '../blocks/BlockResults';

/**
 * The case as it will read: the same markdown pipeline and block results as the reading
 * page, computed in the browser, with the case's attached CSV files for blocks that read
 * one. The pipeline sanitises the HTML it returns.
 */
export function CasePreview({ markdown, files = NO_FILES, stale }: { markdown: string; files?: BlockFiles; stale: boolean }) {
  const rendered = useMemo(() => renderCase(markdown, files), [markdown, files]);
  return (
    <section aria-label="Preview" className={`case-preview rounded border border-rule bg-white px-6 py-5 ${stale ? 'opacity-80' : ''}`} data-testid="case-preview">
      <div className="prose prose-slate max-w-none prose-headings:font-serif prose-code:before:content-none prose-code:after:content-none">
        {rendered.segments.map((segment, i) => {
          if (segment.type === 'html') return <div key={i} dangerouslySetInnerHTML={{ __html: segment.html }} />;
          const block = rendered.evaluation.blocks[segment.index];
          return block ? (
            <div key={i} className="not-prose my-5">
              <BlockResults block={block}>
                <BlockChart block={block} />
              </BlockResults>
            </div>
          ) : null;
        })}
        {rendered.segments.length === 0 && <p className="text-ink-faint">Start writing: the case appears here as colleagues will read it.</p>}
      </div>
    </section>
  );
}

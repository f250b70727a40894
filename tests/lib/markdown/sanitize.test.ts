/**
 * renderCase / renderMarkdown against script injection. Vectors adapted from the OWASP
 * "XSS Filter Evasion Cheat Sheet" (OWASP Cheat Sheet Series), each written as case markdown:
 * raw HTML (which the pipeline drops), markdown links, images and autolinks (which the
 * sanitiser's URL allow-list guards), and KaTeX commands (which `trust: false` disarms).
 */
import { describe, expect, it } from 'vitest';
import { renderCase, renderMarkdown } from '@/lib/markdown';

interface Tag {
  readonly name: string;
  readonly attributes: ReadonlyMap<string, string>;
}

const ENTITY = /&(#x[0-9a-f]+|#\d+|colon|tab|newline|amp|quot|lt|gt);?/gi;
const NAMED: Record<string, string> = { colon: ':', tab: '\t', newline: '\n', amp: '&', quot: '"', lt: '<', gt: '>' };

/** Decodes the character references a browser would decode in an attribute value. */
function decode(value: string): string {
  return value.replace(ENTITY, (_, ref: string) => {
    const r = ref.toLowerCase();
    if (r.startsWith('#x')) return String.fromCodePoint(parseInt(r.slice(2), 16));
    if (r.startsWith('#')) return String.fromCodePoint(parseInt(r.slice(1), 10));
    return NAMED[r] ?? '';
  });
}

/** Every start tag of serialised HTML with its attributes (values decoded). */
function tagsOf(html: string): Tag[] {
  const tags: Tag[] = [];
  for (const m of html.matchAll(/<([a-zA-Z][\w:-]*)((?:\s+[^\s"'>/=]+(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s"'=<>`]+))?)*)\s*\/?>/g)) {
    const attributes = new Map<string, string>();
    for (const a of m[2]!.matchAll(/([^\s"'>/=]+)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+)))?/g)) {
      attributes.set(a[1]!.toLowerCase(), decode(a[2] ?? a[3] ?? a[4] ?? ''));
    }
    tags.push({ name: m[1]!.toLowerCase(), attributes });
  }
  return tags;
}

const URL_ATTRIBUTES = ['href', 'src', 'xlink:href', 'action', 'formaction', 'data', 'srcset', 'poster', 'background', 'lowsrc', 'dynsrc'];
// KaTeX draws radicals and wide accents with its own <svg> paths, so <svg> itself is allowed;
// its attributes are checked like any other tag's.
const FORBIDDEN_TAGS = ['script', 'iframe', 'frame', 'object', 'embed', 'style', 'link', 'meta', 'base', 'form', 'body', 'mglyph', 'foreignobject', 'applet', 'xml'];
const BAD_SCHEME = /^(javascript|vbscript|data|livescript|mocha):/i;

/** Asserts the rendered HTML can run no script, whatever the vector tried. */
function expectSafe(html: string): void {
  expect(html).not.toMatch(/<script/i);
  for (const tag of tagsOf(html)) {
    expect(FORBIDDEN_TAGS, `<${tag.name}> must not be rendered`).not.toContain(tag.name);
    for (const [name, value] of tag.attributes) {
      expect(name, `event handler ${name} on <${tag.name}>`).not.toMatch(/^on/);
      if (URL_ATTRIBUTES.includes(name)) {
        // Browsers ignore ASCII whitespace and control characters inside a scheme.
        const squeezed = value.replace(/[\u0000-\u0020\u007f]+/g, '');
        expect(squeezed, `${name} on <${tag.name}>`).not.toMatch(BAD_SCHEME);
      }
      if (name === 'style') expect(value, `style on <${tag.name}>`).not.toMatch(/expression|url\s*\(|javascript|behavior|@import/i);
    }
  }
}

/** Body HTML of a case, all segments joined. */
const caseHtml = (markdown: string) =>
  renderCase(markdown)
    .segments.map((s) => (s.type === 'html' ? s.html : ''))
    .join('');

const VECTORS: readonly (readonly [string, string])[] = [
  ['script tag with external source', 'Before\n\n<SCRIPT SRC=https://xss.example/xss.js></SCRIPT>\n\nAfter'],
  ['inline script between paragraphs', 'Text <script>alert(1)</script> more'],
  ['nested script split to defeat naive filters', '<scr<script>ipt>alert(1)</scr</script>ipt>'],
  ['image with javascript: source', '<IMG SRC="javascript:alert(\'XSS\');">'],
  ['image with unquoted mixed-case scheme', '<IMG SRC=JaVaScRiPt:alert(\'XSS\')>'],
  ['image with decimal character references', '<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#39;&#88;&#83;&#83;&#39;&#41;>'],
  ['image with hex references without semicolons', '<IMG SRC=&#x6A&#x61&#x76&#x61&#x73&#x63&#x72&#x69&#x70&#x74&#x3A&#x61&#x6C&#x65&#x72&#x74&#x28&#x27&#x58&#x53&#x53&#x27&#x29>'],
  ['image with an embedded tab in the scheme', '<IMG SRC="jav\tascript:alert(\'XSS\');">'],
  ['image with an encoded newline in the scheme', '<IMG SRC="jav&#x0A;ascript:alert(\'XSS\');">'],
  ['image with onerror handler', 'Depth <img src=x onerror=alert(1)> here'],
  ['svg with onload handler', '<svg/onload=alert(\'XSS\')>'],
  ['body with onload handler', '<BODY ONLOAD=alert(\'XSS\')>'],
  ['iframe with javascript: source', '<IFRAME SRC="javascript:alert(\'XSS\');"></IFRAME>'],
  ['object with a scriptlet', '<OBJECT TYPE="text/x-scriptlet" DATA="https://xss.example/scriptlet.html"></OBJECT>'],
  ['embed with a base64 svg', '<EMBED SRC="data:image/svg+xml;base64,PHN2ZyB4bWxuczpzdmc9Imh0dH A6Ly93d3cudzMub3JnLzIwMDAvc3ZnIj48c2NyaXB0PmFsZXJ0KDEpPC9zY3JpcHQ+PC9zdmc+" type="image/svg+xml" AllowScriptAccess="always"></EMBED>'],
  ['div with style expression()', '<DIV STYLE="width: expression(alert(\'XSS\'));">x</DIV>'],
  ['div with style url(javascript:)', '<DIV STYLE="background-image: url(javascript:alert(\'XSS\'))">x</DIV>'],
  ['style element with @import', '<STYLE>@import\'https://xss.example/xss.css\';</STYLE>'],
  ['anchor with data:text/html base64', '<A HREF="data:text/html;base64,PHNjcmlwdD5hbGVydCgnWFNTJyk8L3NjcmlwdD4K">X</A>'],
  ['anchor with &colon; in the scheme', '<a href="javascript&colon;alert(1)">x</a>'],
  ['math/mglyph/style mutation', '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>'],
  ['noscript/title breakout mutation', '<noscript><p title="</noscript><img src=x onerror=alert(1)>">'],
  ['markdown link to javascript:', '[x](javascript:alert(1))'],
  ['markdown link with mixed case and leading space', '[x]( JaVaScRiPt:alert(1))'],
  ['markdown link with an entity in the scheme', '[x](&#106;avascript:alert(1))'],
  ['markdown link with an encoded colon', '[x](javascript&#58;alert(1))'],
  ['markdown link with a tab inside the scheme', '[x](<java\tscript:alert(1)>)'],
  ['markdown link to vbscript:', '[x](vbscript:msgbox(1))'],
  ['markdown link to data:text/html', '[x](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)'],
  ['reference-style link to javascript:', '[x][evil]\n\n[evil]: javascript:alert(1)'],
  ['autolink with javascript:', '<javascript:alert(1)>'],
  ['autolink with vbscript:', '<vbscript:msgbox(1)>'],
  ['markdown image with javascript: source', '![x](javascript:alert(1))'],
  ['markdown image with data: source', '![x](data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+)'],
  ['markdown image alt breaking out of quotes', '![x" onerror="alert(1)](https://img.example/a.png)'],
  ['markdown image title breaking out of quotes', '![x](https://img.example/a.png "t\\" onerror=\\"alert(1)")'],
  ['markdown link title breaking out of quotes', '[x](https://ok.example "t\' onmouseover=\'alert(1)")'],
  ['code fence info string breaking out of the class', '```js" onclick="alert(1)\ncode\n```'],
  ['KaTeX \\href with javascript:', 'Formula $\\href{javascript:alert(1)}{click}$'],
  ['KaTeX \\url with javascript:', '$$\n\\url{javascript:alert(1)}\n$$'],
  ['KaTeX \\htmlStyle and \\htmlId', '$\\htmlStyle{background:url(javascript:alert(1))}{x} \\htmlId{x" onload="alert(1)}{y}$'],
  ['KaTeX \\includegraphics with javascript:', '$\\includegraphics{javascript:alert(1)}$'],
  ['HTML inside inline math', 'Flow $<img src=x onerror=alert(1)>$ and $</span><script>alert(1)</script>$'],
  ['HTML inside display math', '$$\n<svg onload=alert(1)></svg>\n$$'],
  ['HTML comment hiding a script', '<!--><script>alert(1)</script>-->'],
];

describe('renderCase sanitises (OWASP XSS Filter Evasion Cheat Sheet vectors)', () => {
  it.each(VECTORS)('%s', (_title, markdown) => {
    expectSafe(caseHtml(markdown));
    expectSafe(renderMarkdown(markdown));
  });

  it('drops inline raw tags but keeps the text around them as inert text', () => {
    expect(renderMarkdown('Before <script>alert(1)</script> after')).toBe('<p>Before alert(1) after</p>');
  });

  it('drops a raw HTML block with its content', () => {
    expect(renderMarkdown('<script>\nalert(1)\n</script>\n\nAfter')).toBe('<p>After</p>');
  });

  it('renders no element at all for raw svg, iframe or object markup', () => {
    const html = renderMarkdown('<svg onload=alert(1)></svg>\n\n<iframe src="https://x.example"></iframe>\n\n<object data="x"></object>');
    expect(html).not.toMatch(/<(svg|iframe|object)/i);
  });

  it('keeps a link whose javascript: target was removed as plain link text', () => {
    const tags = tagsOf(renderMarkdown('[the basin note](javascript:alert(1))'));
    expect(tags.find((t) => t.name === 'a')?.attributes.has('href')).toBe(false);
  });

  it('renders KaTeX \\href without a link when trust is off', () => {
    const html = renderMarkdown('$\\href{https://ok.example}{x}$');
    expect(tagsOf(html).some((t) => t.name === 'a')).toBe(false);
    expect(html).toContain('#9a3026');
  });
});

describe('renderCase keeps legitimate content', () => {
  const body = [
    '# Outlet basin',
    '',
    '## Design flood (Q100)',
    '',
    'See [the method note](/methods/hydraulic-jump), [USBR](https://www.usbr.example/em25) and <mailto:checker@firm.example>.',
    '',
    '| Flow | Q (m³/s) | y2 (m) |',
    '| --- | ---: | ---: |',
    '| design | 85 | 4.12 |',
    '',
    'Inline $\\mathrm{Fr}_1 = V_1/\\sqrt{g y_1}$ and display:',
    '',
    '$$',
    'y_2 = \\frac{y_1}{2}\\left(\\sqrt{1 + 8\\,\\mathrm{Fr}_1^2} - 1\\right)',
    '$$',
    '',
    '```python',
    'y2 = y1 / 2 * (sqrt(1 + 8 * fr1**2) - 1)',
    '```',
    '',
    '![Basin at low flow](https://img.example/basin.jpg "Looking downstream")',
    '',
    '- [x] rating checked',
    '',
    'A note[^1].',
    '',
    '[^1]: From the 2019 survey.',
  ].join('\n');
  const html = caseHtml(body);
  const tags = tagsOf(html);

  it('keeps headings with ids made from their text', () => {
    expect(html).toContain('<h1 id="outlet-basin">Outlet basin</h1>');
    expect(html).toContain('<h2 id="design-flood-q100">');
  });

  it('keeps GFM tables with column alignment', () => {
    expect(html).toMatch(/<table>[\s\S]*<th align="right">Q \(m³\/s\)<\/th>[\s\S]*<td align="right">85<\/td>/);
  });

  it('keeps relative, https and mailto links', () => {
    const hrefs = tags.filter((t) => t.name === 'a').map((t) => t.attributes.get('href'));
    expect(hrefs).toEqual(expect.arrayContaining(['/methods/hydraulic-jump', 'https://www.usbr.example/em25', 'mailto:checker@firm.example']));
  });

  it('renders inline and display math with KaTeX', () => {
    expect(html).toContain('class="katex"');
    expect(html).toContain('class="katex-display"');
    expect(html).toContain('<annotation encoding="application/x-tex">y_2 = \\frac{y_1}{2}');
  });

  it('keeps code with its language class', () => {
    expect(html).toContain('<pre><code class="language-python">y2 = y1 / 2 * (sqrt(1 + 8 * fr1**2) - 1)');
  });

  it('keeps https images with alt and title', () => {
    const img = tags.find((t) => t.name === 'img');
    expect(img?.attributes.get('src')).toBe('https://img.example/basin.jpg');
    expect(img?.attributes.get('alt')).toBe('Basin at low flow');
    expect(img?.attributes.get('title')).toBe('Looking downstream');
  });

  it('keeps task lists as disabled checkboxes and footnotes with working links', () => {
    expect(html).toMatch(/<input type="checkbox" checked disabled>/);
    expect(html).toContain('href="#user-content-fn-1"');
    expect(html).toContain('id="user-content-fn-1"');
  });

  it('is itself safe', () => expectSafe(html));
});

describe('renderCase with invalid math', () => {
  it('shows a formula KaTeX cannot read in the fault colour, without throwing', () => {
    const html = renderMarkdown('Broken $\\frac{1}{$ and $\\notacommand{x}$ and\n\n$$\n\\begin{matrix}\n$$');
    expect(html).toContain('Broken');
    expect(html).toContain('#9a3026');
    expectSafe(html);
  });
});

// @ts-check
// Meilisearch filter expressions: a lazy tokenizer, a recursive-descent parser producing a
// small syntax tree, and a compiler turning the tree into one closure evaluated per document.
//
// Grammar (as the Meilisearch engine parses it; keywords are case-sensitive):
//   filter     = expression EOF
//   expression = or
//   or         = and ("OR" and)*
//   and        = not ("AND" not)*                       AND binds tighter than OR
//   not        = "NOT" not | primary
//   primary    = "(" expression ")" | condition
//   condition  = value ("=" | "!=" | ">" | ">=" | "<" | "<=") value
//              | value "IN" "[" value_list "]"  | value "NOT" "IN" "[" value_list "]"
//              | value "EXISTS" | value "NOT" "EXISTS"
//              | value "IS" "NULL" | value "IS" "NOT" "NULL"
//              | value "IS" "EMPTY" | value "IS" "NOT" "EMPTY"
//              | value value "TO" value                   inclusive range
//              | value "CONTAINS" value | value "STARTS" "WITH" value   (experimental feature)
//   value_list = (value ("," value)* ","?)?
//   value      = word | 'single quoted' | "double quoted"   (backslash escapes inside quotes)
//   word       = (letter | digit | "_" | "-" | ".")+ that is not a keyword
// The array form of `filter` is handled by parseFilterParam: the outer array is an AND of its
// elements, an inner array an OR of its strings.
//
// Errors carry Meilisearch's wording and a `start:end input` line (1-based columns counted in
// characters), e.g. "Was expecting a value but instead got nothing.\n14:14 channel =".
import { facetValueOf, filterFeatures, filterablePatterns, flatten, normalizeFacet } from './fields.mjs';

/** @typedef {import('./fields.mjs').FacetValue} FacetValue */

/**
 * @typedef {object} CondNode
 * @property {'cond'} type
 * @property {'=' | '!=' | '>' | '>=' | '<' | '<=' | 'to' | 'in' | 'exists' | 'null' | 'empty' | 'contains' | 'startsWith'} op
 * @property {string} field
 * @property {Span} span            where the attribute is written
 * @property {string} [value]       for comparisons, CONTAINS and STARTS WITH
 * @property {string} [from]        for TO
 * @property {string} [to]          for TO
 * @property {string[]} [values]    for IN
 * @property {Span} [opSpan]        where the operator keyword is (CONTAINS, STARTS WITH)
 */
/** @typedef {{ type: 'and' | 'or', children: FilterNode[] }} ListNode */
/** @typedef {{ type: 'not', child: FilterNode }} NotNode */
/** @typedef {CondNode | ListNode | NotNode} FilterNode */
/** @typedef {{ start: number, end: number, input: string }} Span  character offsets in `input` */

const KEYWORDS = new Set(['AND', 'OR', 'IN', 'NOT', 'TO', 'EXISTS', 'IS', 'NULL', 'EMPTY', 'CONTAINS', 'STARTS', 'WITH', '_geoRadius', '_geoBoundingBox']);
const MAX_DEPTH = 200;
const VALUE_CHAR = /[\p{Alphabetic}\p{N}_.-]/u;
const WHITESPACE = /\s/u;
const OPERATION_LIST =
  'Was expecting an operation `=`, `!=`, `>=`, `>`, `<=`, `<`, `IN`, `NOT IN`, `TO`, `EXISTS`, `NOT EXISTS`, `IS NULL`, `IS NOT NULL`, `IS EMPTY`, `IS NOT EMPTY`, `CONTAINS`, `NOT CONTAINS`, `STARTS WITH`, `NOT STARTS WITH`, `_geoRadius`, or `_geoBoundingBox`';

/** A syntax or validation error in a filter; `message` includes the position line. */
export class FilterError extends Error {
  /**
   * @param {string} diagnostic  first line
   * @param {Span} span          the part of the input the diagnostic is about
   */
  constructor(diagnostic, span) {
    const chars = Array.from(span.input);
    super(`${diagnostic}\n${span.start + 1}:${span.end + 1} ${span.input}`);
    this.name = 'FilterError';
    this.diagnostic = diagnostic;
    this.span = span;
    this.columns = { start: span.start + 1, end: span.end + 1, length: chars.length };
  }
}

/** The filter value of the wrong JSON type (not a string or array). */
export class FilterTypeError extends Error {}

/** Rust's `escape_debug` for the parts of the input quoted in messages. @param {string} s */
function escapeDebug(s) {
  return s.replace(/[\\'"\n\r\t]/g, (c) => ({ '\\': '\\\\', "'": "\\'", '"': '\\"', '\n': '\\n', '\r': '\\r', '\t': '\\t' })[c] ?? c);
}

/**
 * @typedef {object} Token
 * @property {'word' | 'str' | 'op' | '(' | ')' | '[' | ']' | ',' | 'bad' | 'eof'} kind
 * @property {number} start   character offset of the first character
 * @property {number} end     character offset after the last character
 * @property {string} text    the characters as written
 * @property {string} [value] the value of a word or quoted string (unescaped)
 * @property {FilterError} [error] a quoted string that cannot be read (reported when a value is needed)
 */

/** Turns the input into tokens on demand, so errors come in the order a reader meets them. */
class Lexer {
  /** @param {string} input */
  constructor(input) {
    this.input = input;
    this.chars = Array.from(input);
    this.pos = 0;
    /** @type {Token[]} */
    this.buffer = [];
  }

  /** @param {number} start @param {number} [end] */
  span(start, end = this.chars.length) {
    return { start, end, input: this.input };
  }

  /** @param {number} start @param {number} end */
  text(start, end) {
    return this.chars.slice(start, end).join('');
  }

  /** @param {number} [ahead] @returns {Token} */
  peek(ahead = 0) {
    while (this.buffer.length <= ahead) this.buffer.push(this.lex());
    return /** @type {Token} */ (this.buffer[ahead]);
  }

  /** @returns {Token} */
  next() {
    const token = this.peek();
    this.buffer.shift();
    return token;
  }

  /** The characters from `start` up to the next whitespace or syntax character (for "got `…`"). @param {number} start */
  errorWord(start) {
    let end = start;
    while (end < this.chars.length) {
      const c = /** @type {string} */ (this.chars[end]);
      if (WHITESPACE.test(c) || '()=<>!'.includes(c)) break;
      end += 1;
    }
    return this.span(start, end);
  }

  /** @returns {Token} */
  lex() {
    const { chars } = this;
    let p = this.pos;
    while (p < chars.length && WHITESPACE.test(/** @type {string} */ (chars[p]))) p += 1;
    const start = p;
    if (p >= chars.length) {
      this.pos = p;
      return { kind: 'eof', start, end: start, text: '' };
    }
    const c = /** @type {string} */ (chars[p]);
    /** @param {Token['kind']} kind @param {number} end @returns {Token} */
    const token = (kind, end) => {
      this.pos = end;
      return { kind, start, end, text: this.text(start, end) };
    };
    if (VALUE_CHAR.test(c)) {
      let end = p + 1;
      while (end < chars.length && VALUE_CHAR.test(/** @type {string} */ (chars[end]))) end += 1;
      const t = token('word', end);
      t.value = t.text;
      return t;
    }
    if (c === '"' || c === "'") return this.lexQuoted(start, c);
    if (c === '=') return token('op', p + 1);
    if (c === '!' || c === '<' || c === '>') {
      if (chars[p + 1] === '=') return token('op', p + 2);
      return c === '!' ? token('bad', p + 1) : token('op', p + 1);
    }
    if ('()[],'.includes(c)) return token(/** @type {Token['kind']} */ (c), p + 1);
    let end = p + 1;
    while (end < chars.length) {
      const d = /** @type {string} */ (chars[end]);
      if (WHITESPACE.test(d) || '()=<>!"\'[],'.includes(d) || VALUE_CHAR.test(d)) break;
      end += 1;
    }
    return token('bad', end);
  }

  /** @param {number} start position of the opening quote @param {string} quote @returns {Token} */
  lexQuoted(start, quote) {
    const { chars } = this;
    let p = start + 1;
    while (p < chars.length) {
      const c = chars[p];
      if (c === quote) {
        const raw = this.text(start + 1, p);
        this.pos = p + 1;
        /** @type {Token} */
        const t = { kind: 'str', start, end: p + 1, text: this.text(start, p + 1) };
        try {
          t.value = unescape(raw, this.span(start + 1, p));
        } catch (error) {
          t.error = /** @type {FilterError} */ (error);
        }
        return t;
      }
      if (c === '\\') {
        if (p + 1 >= chars.length) {
          this.pos = chars.length;
          return { kind: 'str', start, end: chars.length, text: this.text(start, chars.length), error: new FilterError(`Malformed value: \`${escapeDebug(this.text(start + 1, chars.length))}\`.`, this.span(start + 1)) };
        }
        p += 2;
        continue;
      }
      p += 1;
    }
    this.pos = chars.length;
    const rest = this.text(start, chars.length);
    return {
      kind: 'str',
      start,
      end: chars.length,
      text: rest,
      error: new FilterError(`Expression \`${escapeDebug(rest)}\` is missing the following closing delimiter: \`${quote}\`.`, this.span(start)),
    };
  }
}

/**
 * The content of a quoted value with its escapes resolved: `\\`, `\"`, `\'`, `\n`, `\r`,
 * `\t`, `\0`, `\xHH`, `\u{H…}` and `\uHHHH`. Any other escape is a malformed value.
 * @param {string} raw
 * @param {Span} span
 */
function unescape(raw, span) {
  if (!raw.includes('\\')) return raw;
  let out = '';
  for (let i = 0; i < raw.length; i += 1) {
    const c = raw[i];
    if (c !== '\\') {
      out += c;
      continue;
    }
    const n = raw[i + 1];
    i += 1;
    const simple = { '\\': '\\', '"': '"', "'": "'", n: '\n', r: '\r', t: '\t', 0: '\0' }[/** @type {string} */ (n)];
    if (simple !== undefined) {
      out += simple;
      continue;
    }
    if (n === 'x') {
      const hex = raw.slice(i + 1, i + 3);
      if (!/^[0-9a-fA-F]{2}$/.test(hex)) throw new FilterError(`Found an invalid escaped sequence number: \`${escapeDebug(raw)}\`.`, span);
      out += String.fromCharCode(parseInt(hex, 16));
      i += 2;
      continue;
    }
    if (n === 'u') {
      const braced = /^\{([0-9a-fA-F]{1,6})\}/.exec(raw.slice(i + 1));
      const plain = /^[0-9a-fA-F]{4}/.exec(raw.slice(i + 1));
      const hex = braced ? braced[1] : plain ? plain[0] : null;
      const code = hex ? parseInt(hex, 16) : NaN;
      if (!hex || code > 0x10ffff || (code >= 0xd800 && code <= 0xdfff)) {
        throw new FilterError(`Found an invalid escaped sequence number: \`${escapeDebug(raw)}\`.`, span);
      }
      out += String.fromCodePoint(code);
      i += braced ? /** @type {string} */ (braced[0]).length : 4;
      continue;
    }
    throw new FilterError(`Malformed value: \`${escapeDebug(raw)}\`.`, span);
  }
  return out;
}

/** @param {Token} t */
const isKeyword = (t) => t.kind === 'word' && KEYWORDS.has(/** @type {string} */ (t.value));
/** @param {Token} t @param {string} word */
const isWord = (t, word) => t.kind === 'word' && t.value === word;
/** A word that is not a keyword, or a quoted string (maybe unreadable). @param {Token} t */
const isValue = (t) => (t.kind === 'word' && !isKeyword(t)) || t.kind === 'str';

class Parser {
  /** @param {string} input */
  constructor(input) {
    this.lexer = new Lexer(input);
  }

  /** @param {number} start */
  rest(start) {
    return this.lexer.span(start);
  }

  /** @param {number} depth */
  checkDepth(depth) {
    if (depth > MAX_DEPTH) {
      throw new FilterError(
        'The filter exceeded the maximum depth limit. Try rewriting the filter so that it contains fewer nested conditions.',
        this.rest(this.lexer.peek().start),
      );
    }
  }

  /** @returns {FilterNode} */
  parseFilter() {
    const node = this.parseOr(0);
    const t = this.lexer.peek();
    if (t.kind !== 'eof') {
      const span = this.rest(t.start);
      throw new FilterError(`Found unexpected characters at the end of the filter: \`${escapeDebug(this.lexer.text(span.start, span.end))}\`. You probably forgot an \`OR\` or an \`AND\` rule.`, span);
    }
    return node;
  }

  /** @param {number} depth @returns {FilterNode} */
  parseOr(depth) {
    this.checkDepth(depth);
    const children = [this.parseAnd(depth + 1)];
    while (isWord(this.lexer.peek(), 'OR')) {
      this.lexer.next();
      children.push(this.parseAnd(depth + 1));
    }
    return children.length === 1 ? /** @type {FilterNode} */ (children[0]) : { type: 'or', children };
  }

  /** @param {number} depth @returns {FilterNode} */
  parseAnd(depth) {
    this.checkDepth(depth);
    const children = [this.parseNot(depth + 1)];
    while (isWord(this.lexer.peek(), 'AND')) {
      this.lexer.next();
      children.push(this.parseNot(depth + 1));
    }
    return children.length === 1 ? /** @type {FilterNode} */ (children[0]) : { type: 'and', children };
  }

  /** @param {number} depth @returns {FilterNode} */
  parseNot(depth) {
    this.checkDepth(depth);
    if (isWord(this.lexer.peek(), 'NOT')) {
      this.lexer.next();
      const inner = this.parseNot(depth + 1);
      return inner.type === 'not' ? inner.child : { type: 'not', child: inner };
    }
    return this.parsePrimary(depth + 1);
  }

  /** @param {number} start where the primary begins @returns {never} */
  invalidPrimary(start) {
    const span = this.rest(start);
    const text = this.lexer.text(span.start, span.end);
    throw new FilterError(text.trim() === '' ? `${OPERATION_LIST} but instead got nothing.` : `${OPERATION_LIST} at \`${escapeDebug(text)}\`.`, span);
  }

  /** Reads a value where one is required. @returns {{ value: string, span: Span }} */
  expectValue() {
    const t = this.lexer.peek();
    if (t.kind === 'str' && t.error) throw t.error;
    if (isValue(t)) {
      this.lexer.next();
      return { value: /** @type {string} */ (t.value), span: this.lexer.span(t.start, t.end) };
    }
    if (isKeyword(t)) {
      throw new FilterError(
        `Was expecting a value but instead got \`${escapeDebug(t.text)}\`, which is a reserved keyword. To use \`${escapeDebug(t.text)}\` as a field name or a value, surround it by quotes.`,
        this.lexer.span(t.start, t.end),
      );
    }
    const span = this.lexer.errorWord(t.start);
    const word = this.lexer.text(span.start, span.end);
    if (word.trim() === '') throw new FilterError('Was expecting a value but instead got nothing.', span);
    throw new FilterError(`Was expecting a value but instead got \`${escapeDebug(word)}\`.`, span);
  }

  /** @param {number} depth @returns {FilterNode} */
  parsePrimary(depth) {
    this.checkDepth(depth);
    const lexer = this.lexer;
    const first = lexer.peek();
    if (first.kind === '(') {
      lexer.next();
      const node = this.parseOr(depth + 1);
      if (lexer.peek().kind !== ')') {
        const span = this.rest(first.start);
        throw new FilterError(`Expression \`${escapeDebug(lexer.text(span.start, span.end))}\` is missing the following closing delimiter: \`)\`.`, span);
      }
      lexer.next();
      return node;
    }
    if (first.kind === 'word' && /^_geo/.test(/** @type {string} */ (first.value)) && lexer.peek(1).kind === '(') {
      throw new FilterError(`The search fake does not implement geo filters (\`${escapeDebug(/** @type {string} */ (first.value))}\`).`, this.rest(first.start));
    }
    if (isKeyword(first)) {
      throw new FilterError(
        `Was expecting a value but instead got \`${escapeDebug(first.text)}\`, which is a reserved keyword. To use \`${escapeDebug(first.text)}\` as a field name or a value, surround it by quotes.`,
        lexer.span(first.start, first.end),
      );
    }
    if (first.kind === 'str' && first.error) throw first.error;
    if (!isValue(first)) this.invalidPrimary(first.start);
    lexer.next();
    const field = /** @type {string} */ (first.value);
    const span = lexer.span(first.start, first.end);
    /** @param {Omit<CondNode, 'type' | 'field' | 'span'>} rest @returns {CondNode} */
    const cond = (rest) => ({ type: 'cond', field, span, ...rest });

    const t = lexer.peek();
    if (t.kind === 'op') {
      lexer.next();
      const op = /** @type {CondNode['op']} */ (t.text);
      return cond({ op, value: this.expectValue().value });
    }
    if (isWord(t, 'IN')) {
      lexer.next();
      return cond({ op: 'in', values: this.parseInBody() });
    }
    if (isWord(t, 'NOT')) {
      const u = lexer.peek(1);
      if (isWord(u, 'IN')) {
        lexer.next();
        lexer.next();
        return { type: 'not', child: cond({ op: 'in', values: this.parseInBody() }) };
      }
      if (isWord(u, 'EXISTS')) {
        lexer.next();
        lexer.next();
        return { type: 'not', child: cond({ op: 'exists' }) };
      }
      if (isWord(u, 'CONTAINS')) {
        lexer.next();
        lexer.next();
        return { type: 'not', child: cond({ op: 'contains', opSpan: lexer.span(u.start, u.end), value: this.expectValue().value }) };
      }
      if (isWord(u, 'STARTS') && isWord(lexer.peek(2), 'WITH')) {
        lexer.next();
        lexer.next();
        const w = lexer.next();
        return { type: 'not', child: cond({ op: 'startsWith', opSpan: lexer.span(u.start, w.end), value: this.expectValue().value }) };
      }
      this.invalidPrimary(first.start);
    }
    if (isWord(t, 'IS')) {
      const u = lexer.peek(1);
      const negated = isWord(u, 'NOT');
      const what = negated ? lexer.peek(2) : u;
      if (isWord(what, 'NULL') || isWord(what, 'EMPTY')) {
        lexer.next();
        lexer.next();
        if (negated) lexer.next();
        const node = cond({ op: isWord(what, 'NULL') ? 'null' : 'empty' });
        return negated ? { type: 'not', child: node } : node;
      }
      this.invalidPrimary(first.start);
    }
    if (isWord(t, 'EXISTS')) {
      lexer.next();
      return cond({ op: 'exists' });
    }
    if (isWord(t, 'CONTAINS')) {
      lexer.next();
      return cond({ op: 'contains', opSpan: lexer.span(t.start, t.end), value: this.expectValue().value });
    }
    if (isWord(t, 'STARTS') && isWord(lexer.peek(1), 'WITH')) {
      lexer.next();
      const w = lexer.next();
      return cond({ op: 'startsWith', opSpan: lexer.span(t.start, w.end), value: this.expectValue().value });
    }
    if (isValue(t) && !t.error) {
      const to = lexer.peek(1);
      const after = lexer.chars[to.end];
      if (isWord(to, 'TO') && after !== undefined && WHITESPACE.test(after)) {
        lexer.next();
        lexer.next();
        return cond({ op: 'to', from: /** @type {string} */ (t.value), to: this.expectValue().value });
      }
    }
    return this.invalidPrimary(first.start);
  }

  /** After `IN`: `[` value_list `]`. @returns {string[]} */
  parseInBody() {
    const lexer = this.lexer;
    const open = lexer.peek();
    if (open.kind !== '[') throw new FilterError('Expected `[` after `IN` keyword.', this.rest(open.start));
    lexer.next();
    /** @type {string[]} */
    const values = [];
    let t = lexer.peek();
    if (t.kind === 'str' && t.error) throw t.error;
    if (isValue(t)) {
      values.push(this.expectValue().value);
      for (;;) {
        t = lexer.peek();
        if (t.kind !== ',') break;
        const u = lexer.peek(1);
        if (u.kind === 'str' && u.error) throw u.error;
        lexer.next();
        if (!isValue(u)) break;
        values.push(this.expectValue().value);
      }
    }
    t = lexer.peek();
    if (t.kind === ']') {
      lexer.next();
      return values;
    }
    if (t.kind === 'eof') throw new FilterError('Expected matching `]` after the list of field names given to `IN[`', lexer.span(t.start, t.start));
    const span = this.rest(t.start);
    const text = escapeDebug(lexer.text(span.start, span.end));
    throw new FilterError(
      isKeyword(t)
        ? `Expected only comma-separated field names inside \`IN[..]\` but instead found \`${text}\`, which is a keyword. To use \`${text}\` as a field name or a value, surround it by quotes.`
        : `Expected only comma-separated field names inside \`IN[..]\` but instead found \`${text}\`.`,
      span,
    );
  }
}

/**
 * Parses one filter string. An empty or blank string is no filter (null).
 * @param {string} input
 * @returns {FilterNode | null}
 */
export function parseFilterString(input) {
  if (input.trim() === '') return null;
  return new Parser(input).parseFilter();
}

/** @param {string[]} expected @param {unknown} found */
function typeError(expected, found) {
  return new FilterTypeError(`Invalid syntax for the filter parameter: \`expected ${expected.join(', ')}, found: ${JSON.stringify(found)}\`.`);
}

/** @type {Map<string, FilterNode | null>} */
const parsedStrings = new Map();

/** parseFilterString with a small cache (the same filters come again and again). @param {string} input */
function parseCached(input) {
  if (parsedStrings.has(input)) return /** @type {FilterNode | null} */ (parsedStrings.get(input));
  const node = parseFilterString(input);
  if (parsedStrings.size >= 500) parsedStrings.delete(/** @type {string} */ (parsedStrings.keys().next().value));
  parsedStrings.set(input, node);
  return node;
}

/**
 * Parses the `filter` parameter: a string, or an array whose elements are ANDed, an inner
 * array's strings being ORed. Null, an empty string or an empty array is no filter.
 * @param {unknown} filter
 * @returns {FilterNode | null}
 * @throws {FilterError | FilterTypeError}
 */
export function parseFilterParam(filter) {
  if (filter === null || filter === undefined) return null;
  if (typeof filter === 'string') return parseCached(filter);
  if (!Array.isArray(filter)) throw typeError(['String', 'Array'], filter);
  /** @type {FilterNode[]} */
  const ands = [];
  for (const element of filter) {
    if (typeof element === 'string') {
      const node = parseCached(element);
      if (node) ands.push(node);
    } else if (Array.isArray(element)) {
      /** @type {FilterNode[]} */
      const ors = [];
      for (const inner of element) {
        if (typeof inner !== 'string') throw typeError(['String'], inner);
        const node = parseCached(inner);
        if (node) ors.push(node);
      }
      if (ors.length === 1) ands.push(/** @type {FilterNode} */ (ors[0]));
      else if (ors.length > 1) ands.push({ type: 'or', children: ors });
    } else {
      throw typeError(['String', '[String]'], element);
    }
  }
  if (ands.length === 0) return null;
  return ands.length === 1 ? /** @type {FilterNode} */ (ands[0]) : { type: 'and', children: ands };
}

/** @param {FilterNode} node @param {(c: CondNode) => void} visit */
function eachCondition(node, visit) {
  if (node.type === 'cond') visit(node);
  else if (node.type === 'not') eachCondition(node.child, visit);
  else for (const child of node.children) eachCondition(child, visit);
}

/** Finite number as Rust's `f64` parser reads it, or null. @param {string} s */
export function parseFiniteFloat(s) {
  if (!/^[+-]?(?:\d+\.?\d*(?:[eE][+-]?\d+)?|\.\d+(?:[eE][+-]?\d+)?)$/.test(s)) return null;
  const n = Number(s);
  return Number.isFinite(n) ? n : null;
}

const COMPARISON_OPS = new Set(['>', '>=', '<', '<=', 'to']);
/** @param {CondNode} c */
const opName = (c) => ({ to: 'TO', in: 'IN', exists: 'EXISTS', null: 'IS NULL', empty: 'IS EMPTY', contains: 'CONTAINS', startsWith: 'STARTS WITH' })[/** @type {string} */ (c.op)] ?? c.op;

/**
 * @typedef {object} CompileContext
 * @property {Array<string | {attributePatterns: string[], features?: any}>} filterableAttributes
 * @property {boolean} [containsFilter]   the experimental CONTAINS / STARTS WITH operators are enabled
 * @property {(field: string) => (doc: any) => FacetValue} valueGetter  the field's values for one document
 */

/** An error the caller reports with its own code (`feature_not_enabled`). */
export class FilterFeatureError extends FilterError {}

/**
 * Checks that every attribute is filterable (and allows its operators) and compiles the tree
 * into a predicate over documents.
 * @param {FilterNode} node
 * @param {CompileContext} ctx
 * @returns {(doc: any) => boolean}
 * @throws {FilterError}
 */
export function compileFilter(node, ctx) {
  checkFilter(node, ctx);
  return build(node, ctx);
}

/**
 * Checks that every attribute of the tree is filterable and allows its operator.
 * @param {FilterNode} node
 * @param {Omit<CompileContext, 'valueGetter'>} ctx
 * @throws {FilterError}
 */
export function checkFilter(node, ctx) {
  eachCondition(node, (c) => {
    const features = filterFeatures(c.field, ctx.filterableAttributes);
    if (!features || (!features.equality && !features.comparison)) {
      const patterns = filterablePatterns(ctx.filterableAttributes);
      const available =
        patterns.length === 0
          ? ' This index does not have configured filterable attributes.'
          : ` Available filterable attribute patterns are: ${patterns.map((p) => `\`${p}\``).join(', ')}.`;
      throw new FilterError(`Attribute \`${escapeDebug(c.field)}\` is not filterable.${available}`, c.span);
    }
    const comparison = COMPARISON_OPS.has(c.op);
    if ((comparison && !features.comparison) || (!comparison && !features.equality)) {
      const allowed = features.equality ? 'OR, AND, NOT, =, !=, IN, IS EMPTY, IS NULL, EXISTS' : 'OR, AND, NOT, <, >, <=, >=, TO';
      throw new FilterError(
        `Filter operator \`${opName(c)}\` is not allowed for the attribute \`${escapeDebug(c.field)}\`.\n  - Note: allowed operators: ${allowed}.\n  - Note: field \`${escapeDebug(c.field)}\` matched rule #${features.rule} in \`filterableAttributes\``,
        c.span,
      );
    }
    if ((c.op === 'contains' || c.op === 'startsWith') && !ctx.containsFilter) {
      throw new FilterFeatureError(
        'Using `CONTAINS` or `STARTS WITH` in a filter requires enabling the `contains filter` experimental feature. See https://github.com/orgs/meilisearch/discussions/763',
        /** @type {Span} */ (c.opSpan),
      );
    }
  });
}

/** @param {FilterNode} node @param {CompileContext} ctx @returns {(doc: any) => boolean} */
function build(node, ctx) {
  if (node.type === 'not') {
    const inner = build(node.child, ctx);
    return (doc) => !inner(doc);
  }
  if (node.type === 'and' || node.type === 'or') {
    const parts = node.children.map((child) => build(child, ctx));
    if (parts.length === 2) {
      const [a, b] = /** @type {[(doc: any) => boolean, (doc: any) => boolean]} */ (parts);
      return node.type === 'and' ? (doc) => a(doc) && b(doc) : (doc) => a(doc) || b(doc);
    }
    if (node.type === 'and') {
      return (doc) => {
        for (let i = 0; i < parts.length; i += 1) if (!(/** @type {(doc: any) => boolean} */ (parts[i]))(doc)) return false;
        return true;
      };
    }
    return (doc) => {
      for (let i = 0; i < parts.length; i += 1) if ((/** @type {(doc: any) => boolean} */ (parts[i]))(doc)) return true;
      return false;
    };
  }
  const cond = /** @type {CondNode} */ (node);
  const get = ctx.valueGetter(cond.field);
  const test = valueTest(cond);
  return (doc) => test(get(doc));
}

/**
 * The test one condition applies to a field's values. Strings compare after normalisation
 * for equality; ranges compare the stored (normalised) strings with the value as written,
 * as the engine does, and numbers numerically when the value reads as a number. Any one
 * element of an array field satisfying the test is enough.
 * @param {CondNode} c
 * @returns {(v: FacetValue) => boolean}
 */
export function valueTest(c) {
  switch (c.op) {
    case '=':
      return equalsTest(/** @type {string} */ (c.value));
    case '!=': {
      const eq = equalsTest(/** @type {string} */ (c.value));
      return (v) => !eq(v);
    }
    case 'in': {
      const norms = new Set((c.values ?? []).map(normalizeFacet));
      const nums = new Set((c.values ?? []).map(parseFiniteFloat).filter((n) => n !== null));
      return (v) => {
        for (let i = 0; i < v.strs.length; i += 1) if (norms.has(/** @type {string} */ (v.strs[i]))) return true;
        for (let i = 0; i < v.nums.length; i += 1) if (nums.has(/** @type {number} */ (v.nums[i]))) return true;
        return false;
      };
    }
    case '>':
      return rangeTest(parseFiniteFloat(/** @type {string} */ (c.value)), false, null, false, /** @type {string} */ (c.value), null);
    case '>=':
      return rangeTest(parseFiniteFloat(/** @type {string} */ (c.value)), true, null, false, /** @type {string} */ (c.value), null, true);
    case '<':
      return rangeTest(null, false, parseFiniteFloat(/** @type {string} */ (c.value)), false, null, /** @type {string} */ (c.value));
    case '<=':
      return rangeTest(null, false, parseFiniteFloat(/** @type {string} */ (c.value)), true, null, /** @type {string} */ (c.value), false, true);
    case 'to': {
      const lo = parseFiniteFloat(/** @type {string} */ (c.from));
      const hi = parseFiniteFloat(/** @type {string} */ (c.to));
      const numeric = lo !== null && hi !== null;
      const from = /** @type {string} */ (c.from);
      const to = /** @type {string} */ (c.to);
      return (v) => {
        if (numeric) for (let i = 0; i < v.nums.length; i += 1) if (/** @type {number} */ (v.nums[i]) >= /** @type {number} */ (lo) && /** @type {number} */ (v.nums[i]) <= /** @type {number} */ (hi)) return true;
        for (let i = 0; i < v.strs.length; i += 1) if (/** @type {string} */ (v.strs[i]) >= from && /** @type {string} */ (v.strs[i]) <= to) return true;
        return false;
      };
    }
    case 'exists':
      return (v) => v.exists;
    case 'null':
      return (v) => v.isNull;
    case 'empty':
      return (v) => v.isEmpty;
    case 'contains': {
      const norm = normalizeFacet(/** @type {string} */ (c.value));
      return (v) => v.strs.some((s) => s.includes(norm));
    }
    case 'startsWith': {
      const norm = normalizeFacet(/** @type {string} */ (c.value));
      return (v) => v.strs.some((s) => s.startsWith(norm));
    }
    default:
      throw new Error(`unknown filter operator ${String(c.op)}`);
  }
}

/** @param {string} value @returns {(v: FacetValue) => boolean} */
function equalsTest(value) {
  const norm = normalizeFacet(value);
  const num = parseFiniteFloat(value);
  return (v) => {
    for (let i = 0; i < v.strs.length; i += 1) if (v.strs[i] === norm) return true;
    if (num !== null) for (let i = 0; i < v.nums.length; i += 1) if (v.nums[i] === num) return true;
    return false;
  };
}

/**
 * A one-sided range: numbers against `lo`/`hi` when the value reads as a number, stored
 * strings against the value as written.
 * @param {number | null} lo @param {boolean} loIncl @param {number | null} hi @param {boolean} hiIncl
 * @param {string | null} loStr @param {string | null} hiStr @param {boolean} [loStrIncl] @param {boolean} [hiStrIncl]
 * @returns {(v: FacetValue) => boolean}
 */
function rangeTest(lo, loIncl, hi, hiIncl, loStr, hiStr, loStrIncl = loIncl, hiStrIncl = hiIncl) {
  const numeric = (loStr === null || lo !== null) && (hiStr === null || hi !== null);
  return (v) => {
    if (numeric) {
      for (let i = 0; i < v.nums.length; i += 1) {
        const n = /** @type {number} */ (v.nums[i]);
        if (lo !== null && (loIncl ? n < lo : n <= lo)) continue;
        if (hi !== null && (hiIncl ? n > hi : n >= hi)) continue;
        return true;
      }
    }
    for (let i = 0; i < v.strs.length; i += 1) {
      const s = /** @type {string} */ (v.strs[i]);
      if (loStr !== null && (loStrIncl ? s < loStr : s <= loStr)) continue;
      if (hiStr !== null && (hiStrIncl ? s > hiStr : s >= hiStr)) continue;
      return true;
    }
    return false;
  };
}

/**
 * Convenience for tests and one-off checks: does `doc` satisfy `filter` (string or array
 * form), with every attribute filterable unless `filterableAttributes` says otherwise?
 * @param {unknown} filter
 * @param {Record<string, unknown>} doc
 * @param {{ filterableAttributes?: CompileContext['filterableAttributes'], containsFilter?: boolean }} [options]
 */
export function matchesDocument(filter, doc, options = {}) {
  const node = parseFilterParam(filter);
  if (!node) return true;
  const flat = flatten(doc);
  const predicate = compileFilter(node, {
    filterableAttributes: options.filterableAttributes ?? ['*'],
    containsFilter: options.containsFilter ?? true,
    valueGetter: (field) => () => facetValueOf(flat.get(field)),
  });
  return predicate(doc);
}

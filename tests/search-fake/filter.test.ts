/**
 * The search fake's filter expressions, on the parser module itself: what each expression
 * selects among a few documents (precedence, NOT, ranges, IN, EXISTS / IS NULL / IS EMPTY,
 * quoting and escapes, numbers against strings, array and nested fields, the array form),
 * and the syntax errors with Meilisearch's wording and `start:end` positions.
 */
import { describe, expect, it } from 'vitest';
import { FilterError, matchesDocument, parseFilterParam, parseFilterString } from '../../search-fake/filter.mjs';

const DOCS: Array<Record<string, unknown>> = [
  {
    id: 1,
    title: 'Hydraulic jump',
    firmId: 'firm-a',
    year: 2001,
    froude: 4.5,
    tags: ['jump', 'channel'],
    status: 'published',
    note: null,
    empty: '',
    list: [],
    obj: {},
    nested: { depth: 1.2, kind: 'Weir' },
    code: '10',
    flag: true,
  },
  {
    id: 2,
    title: 'Tidal bore',
    firmId: 'firm-a',
    year: 1999,
    froude: 1.3,
    tags: ['bore'],
    status: 'draft',
    note: 'x',
    nested: { depth: 3 },
    code: 9,
    flag: false,
    'name with space': 'ok',
    city: 'Zürich',
    gauges: [{ depth: 1 }, { depth: 7 }],
  },
  {
    id: 3,
    title: 'Stilling basin',
    firmId: 'firm-b',
    year: 2010,
    froude: 9,
    tags: [],
    status: 'Published',
    comma: 'a, b',
    bracket: 'x]y',
    quote: 'say "hi"',
    apostrophe: "it's",
    backslash: 'a\\b',
    OR: 'keyword-named field',
  },
  { id: 4, title: 'Weir', firmId: 'firm-b', year: '2005', tags: ['weir', 'Jump'], status: 'in review', crafted: 'a" OR firmId = "b' },
];

const ids = (filter: unknown, options?: Parameters<typeof matchesDocument>[2]) =>
  DOCS.filter((doc) => matchesDocument(filter, doc, options)).map((doc) => doc.id);

describe('what a filter selects', () => {
  it.each<[string, number[]]>([
    // equality: strings compare without case, numbers numerically
    ['firmId = firm-a', [1, 2]],
    ['firmId = "firm-a"', [1, 2]],
    ["firmId = 'FIRM-A'", [1, 2]],
    ['status = published', [1, 3]],
    ['status = "in review"', [4]],
    ['firmId != firm-a', [3, 4]],
    ['city = "ZÜRICH"', [2]],
    ['flag = true', [1]],
    ['flag = false', [2]],
    // numbers against strings: a number only equals a number, a string only a string
    ['code = 10', [1]],
    ['code = 9', [2]],
    ['code = 9.0', [2]],
    ['code > 5', [2]],
    ['froude >= 4.5e0', [1, 3]],
    ['froude > .5e1', [3]],
    // comparisons: numbers numerically, string values lexicographically (year "2005" is a string)
    ['year > 2000', [1, 3, 4]],
    ['year >= 2001', [1, 3, 4]],
    ['year < 2000', [2]],
    ['year <= 1999', [2]],
    ['year 1999 TO 2001', [1, 2]],
    ['froude 1.3 TO 4.5', [1, 2]],
    ['froude 5 TO 1', []],
    ['NOT froude 1.3 TO 4.5', [3, 4]],
    // arrays: any element
    ['tags = jump', [1, 4]],
    ['tags IN [bore, weir]', [2, 4]],
    ['tags NOT IN [jump]', [2, 3]],
    ['tags IN []', []],
    ['tags NOT IN []', [1, 2, 3, 4]],
    ['tags IN [jump,]', [1, 4]],
    ['gauges.depth > 5', [2]],
    // EXISTS, IS NULL, IS EMPTY and their negations
    ['tags EXISTS', [1, 2, 3, 4]],
    ['note EXISTS', [1, 2]],
    ['note NOT EXISTS', [3, 4]],
    ['NOT note EXISTS', [3, 4]],
    ['note IS NULL', [1]],
    ['note IS NOT NULL', [2, 3, 4]],
    ['empty IS EMPTY', [1]],
    ['list IS EMPTY', [1]],
    ['obj IS EMPTY', [1]],
    ['tags IS EMPTY', [3]],
    ['tags IS NOT EMPTY', [1, 2, 4]],
    ['missing IS NOT EMPTY', [1, 2, 3, 4]],
    // nested objects by dotted name
    ['nested.depth > 2', [2]],
    ['nested.kind = weir', [1]],
    ['nested EXISTS', [1, 2]],
    // AND binds tighter than OR; NOT; parentheses
    ['firmId = firm-a AND year > 2000 OR firmId = firm-b', [1, 3, 4]],
    ['firmId = firm-a AND (year > 2000 OR firmId = firm-b)', [1]],
    ['firmId = firm-a OR firmId = firm-b AND status = draft', [1, 2]],
    ['(firmId = firm-a OR firmId = firm-b) AND status = draft', [2]],
    ['NOT firmId = firm-a', [3, 4]],
    ['NOT NOT firmId = firm-a', [1, 2]],
    ['NOT (firmId = firm-a OR status = draft)', [3, 4]],
    ['NOT(firmId = firm-a)', [3, 4]],
    ['((firmId = firm-a) AND ((year < 2000) OR (tags = jump)))', [1, 2]],
    ['firmId = firm-a AND NOT tags = bore AND year > 1000', [1]],
    // whitespace, line breaks, operators without spaces
    [' firmId   =\n firm-a ', [1, 2]],
    ['firmId=firm-b AND year>=2010', [3]],
    // quoted values with commas, brackets, quotes and escapes
    ['comma IN ["a, b", x]', [3]],
    ["comma = 'a, b'", [3]],
    ['bracket IN ["x]y"]', [3]],
    [`quote = 'say "hi"'`, [3]],
    ['quote = "say \\"hi\\""', [3]],
    ["apostrophe = 'it\\'s'", [3]],
    ['apostrophe = "it\'s"', [3]],
    ['backslash = "a\\\\b"', [3]],
    // quoted attribute names, keywords as names or values
    ['"name with space" = ok', [2]],
    ['"OR" EXISTS', [3]],
    ['status = "AND"', []],
  ])('%s', (filter, expected) => expect(ids(filter)).toEqual(expected));

  it('keeps a crafted value inside its quotes (one firm cannot reach another)', () => {
    const escape = (v: string) => `"${v.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
    expect(ids(`firmId = ${escape('a" OR firmId = "firm-a')}`)).toEqual([]);
    expect(ids(`crafted = ${escape('a" OR firmId = "b')}`)).toEqual([4]);
    expect(ids(`firmId = ${escape('firm-b\\" OR firmId = \\"firm-a')}`)).toEqual([]);
    expect(ids(`firmId = ${escape('x') } OR firmId = ${escape('firm-a')}`)).toEqual([1, 2]);
  });

  it.each<[unknown, number[]]>([
    [['firmId = firm-a', 'tags = jump'], [1]],
    [[['firmId = firm-a', 'firmId = firm-b'], 'year > 2000'], [1, 3, 4]],
    [[['status = draft', 'status = "in review"']], [2, 4]],
    [['', 'firmId = firm-b'], [3, 4]],
    [[], [1, 2, 3, 4]],
    [[[]], [1, 2, 3, 4]],
    ['', [1, 2, 3, 4]],
    ['   ', [1, 2, 3, 4]],
    [null, [1, 2, 3, 4]],
  ])('array form %j', (filter, expected) => expect(ids(filter)).toEqual(expected));

  it('CONTAINS and STARTS WITH (an experimental feature in Meilisearch)', () => {
    expect(ids('title CONTAINS DRA', { containsFilter: true })).toEqual([1]);
    expect(ids('title NOT CONTAINS a', { containsFilter: true })).toEqual([4]);
    expect(ids('title STARTS WITH tid', { containsFilter: true })).toEqual([2]);
    expect(() => ids('title CONTAINS dra', { containsFilter: false })).toThrow(/contains filter/);
  });

  it('only lets filterable attributes through', () => {
    expect(ids('firmId = firm-a', { filterableAttributes: ['firmId'] })).toEqual([1, 2]);
    expect(ids('nested.depth > 2', { filterableAttributes: ['nested'] })).toEqual([2]);
    expect(ids('nested.depth > 2', { filterableAttributes: ['nest*'] })).toEqual([2]);
    expect(() => ids('firmId = a AND year > 1', { filterableAttributes: ['firmId', 'tags'] })).toThrow(
      'Attribute `year` is not filterable. Available filterable attribute patterns are: `firmId`, `tags`.\n16:20 firmId = a AND year > 1',
    );
    expect(() => ids('NOT (x = 1)', { filterableAttributes: [] })).toThrow('Attribute `x` is not filterable. This index does not have configured filterable attributes.\n6:7 NOT (x = 1)');
  });

  it('honours granular filterable rules (comparison off by default)', () => {
    const rules = [{ attributePatterns: ['year'], features: { filter: { equality: true } } }];
    expect(ids('year = 1999', { filterableAttributes: rules })).toEqual([2]);
    expect(() => ids('year > 1999', { filterableAttributes: rules })).toThrow(/Filter operator `>` is not allowed for the attribute `year`/);
    const both = [{ attributePatterns: ['year'], features: { filter: { equality: true, comparison: true } } }];
    expect(ids('year 1999 TO 2001', { filterableAttributes: both })).toEqual([1, 2]);
  });
});

describe('how a filter reads', () => {
  it('AND binds tighter than OR, NOT binds tightest, NOT NOT cancels', () => {
    const tree = parseFilterString('a = 1 OR NOT b = 2 AND c = 3');
    expect(tree).toMatchObject({
      type: 'or',
      children: [{ type: 'cond', field: 'a' }, { type: 'and', children: [{ type: 'not', child: { field: 'b' } }, { field: 'c' }] }],
    });
    expect(parseFilterString('NOT NOT NOT x = 5')).toMatchObject({ type: 'not', child: { type: 'cond', field: 'x', op: '=', value: '5' } });
    expect(parseFilterString('NOT NOT (NOT NOT x = 5)')).toMatchObject({ type: 'cond', field: 'x' });
  });

  it('reads the value forms', () => {
    expect(parseFilterString('x IS NOT NULL')).toMatchObject({ type: 'not', child: { op: 'null' } });
    expect(parseFilterString('x NOT IN [a, "b c", \'d\']')).toMatchObject({ type: 'not', child: { op: 'in', values: ['a', 'b c', 'd'] } });
    expect(parseFilterString('x 1 TO 5')).toMatchObject({ op: 'to', from: '1', to: '5' });
    expect(parseFilterString("title = 'foo\\x20\\n\\t\\\"\\''")).toMatchObject({ value: 'foo \n\t"\'' });
    expect(parseFilterString('title = "\\u{1F600}"')).toMatchObject({ value: '😀' });
    expect(parseFilterString('nested.value-x_1 = v.1-2_3')).toMatchObject({ field: 'nested.value-x_1', value: 'v.1-2_3' });
    expect(parseFilterString('x = ""')).toMatchObject({ value: '' });
  });

  it('accepts 49 nested parentheses and rejects 50', () => {
    expect(parseFilterString(`${'('.repeat(49)}x = 1${')'.repeat(49)}`)).toMatchObject({ field: 'x' });
    expect(() => parseFilterString(`${'('.repeat(50)}x = 1${')'.repeat(50)}`)).toThrow(/exceeded the maximum depth limit[\s\S]*\n51:106 /);
  });
});

describe('filter syntax errors', () => {
  const message = (filter: string) => {
    try {
      parseFilterString(filter);
    } catch (error) {
      expect(error).toBeInstanceOf(FilterError);
      return (error as Error).message;
    }
    throw new Error(`no error for ${filter}`);
  };

  it.each<[string, string]>([
    ['channel = Ponce = 12', 'Found unexpected characters at the end of the filter: `= 12`. You probably forgot an `OR` or an `AND` rule.\n17:21 channel = Ponce = 12'],
    ['channel =    ', 'Was expecting a value but instead got nothing.\n14:14 channel =    '],
    ['channel = 🐻 AND followers < 100', 'Was expecting a value but instead got `🐻`.\n11:12 channel = 🐻 AND followers < 100'],
    ['OR', 'Was expecting a value but instead got `OR`, which is a reserved keyword. To use `OR` as a field name or a value, surround it by quotes.\n1:3 OR'],
    ['x = EXISTS', 'Was expecting a value but instead got `EXISTS`, which is a reserved keyword. To use `EXISTS` as a field name or a value, surround it by quotes.\n5:11 x = EXISTS'],
    ["channel = 'ponce", "Expression `\\'ponce` is missing the following closing delimiter: `'`.\n11:17 channel = 'ponce"],
    ['channel = "ponce', 'Expression `\\"ponce` is missing the following closing delimiter: `"`.\n11:17 channel = "ponce'],
    ['channel = mv OR (followers >= 1000', 'Expression `(followers >= 1000` is missing the following closing delimiter: `)`.\n17:35 channel = mv OR (followers >= 1000'],
    ['channel = mv OR followers >= 1000)', 'Found unexpected characters at the end of the filter: `)`. You probably forgot an `OR` or an `AND` rule.\n34:35 channel = mv OR followers >= 1000)'],
    ['colour IN blue, green]', 'Expected `[` after `IN` keyword.\n11:23 colour IN blue, green]'],
    ['colour IN [blue, green', 'Expected matching `]` after the list of field names given to `IN[`\n23:23 colour IN [blue, green'],
    ['colour IN [blue, green, AND]', 'Expected only comma-separated field names inside `IN[..]` but instead found `AND]`, which is a keyword. To use `AND]` as a field name or a value, surround it by quotes.\n25:29 colour IN [blue, green, AND]'],
    ["colour IN ['blue, green", "Expression `\\'blue, green` is missing the following closing delimiter: `'`.\n12:24 colour IN ['blue, green"],
    ["x = 'a\\q'", "Malformed value: `a\\\\q`.\n6:9 x = 'a\\q'"],
  ])('%s', (filter, expected) => expect(message(filter)).toBe(expected));

  it.each([
    ['dangling AND', 'firmId = a AND', /^Was expecting an operation .* but instead got nothing\.\n15:15 /],
    ['dangling OR before a condition', 'OR firmId = a', /reserved keyword/],
    ['two ORs', 'a = 1 OR OR b = 2', /reserved keyword[\s\S]*\n10:12 /],
    ['operator without a value at the end', 'year >', /expecting a value but instead got nothing/],
    ['operator without an attribute', '= 5', /^Was expecting an operation .* at `= 5`\.\n1:4 = 5$/],
    ['a value without an operator', 'channel Ponce', /Was expecting an operation[\s\S]*\n1:14 channel Ponce/],
    ['a misspelt keyword', 'colour NOT EXIST', /Was expecting an operation/],
    ['TO without a space', 'subscribers 100 TO1000', /Was expecting an operation/],
    ['TO at the very end', 'year 1 TO', /^Was expecting an operation .* at `year 1 TO`/],
    ['TO without an end', 'year 1 TO ', /expecting a value but instead got nothing/],
    ['an unclosed parenthesis deep inside', '(a = 1 AND (b = 2 OR c = 3)', /missing the following closing delimiter: `\)`\.\n1:28 /],
    ['an empty pair of parentheses', '()', /Was expecting an operation/],
    ['IS without NULL or EMPTY', 'value IS', /Was expecting an operation/],
    ['a lone !', 'a ! b', /Was expecting an operation/],
    ['a trailing backslash in quotes', 'x = "a\\', /Malformed value/],
    ['a bad \\u escape', 'x = "\\u{zz}"', /invalid escaped sequence number/],
    ['a geo filter', '_geoRadius(1, 2, 3)', /geo filters/],
  ])('%s', (_name, filter, pattern) => expect(message(filter)).toMatch(pattern));

  it('rejects values of the wrong type in the array form', () => {
    expect(() => parseFilterParam(42)).toThrow('Invalid syntax for the filter parameter: `expected String, Array, found: 42`.');
    expect(() => parseFilterParam(['a = 1', 2])).toThrow('`expected String, [String], found: 2`');
    expect(() => parseFilterParam([['a = 1', { b: 1 }]])).toThrow('`expected String, found: {"b":1}`');
  });

  it('reports an error of an array element against that element', () => {
    expect(() => parseFilterParam(['a = 1', ['b = 2', 'c =']])).toThrow('Was expecting a value but instead got nothing.\n4:4 c =');
  });
});

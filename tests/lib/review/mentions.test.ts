import { describe, expect, it } from 'vitest';
import { findMentions } from '../../../src/lib/review/mentions';

const members = [
  { userId: 'u1', email: 'helena.brandt@kestrelweir.example' },
  { userId: 'u2', email: 'josef.warrick@kestrelweir.example' },
  { userId: 'u3', email: 'tomas.ilvar@kestrelweir.example' },
];
const ids = (body: string) => findMentions(body, members).map((m) => m.userId);

describe('findMentions', () => {
  it('finds members by the part of their e-mail before the @, once each, in order', () => {
    expect(ids('@josef.warrick please check, and @helena.brandt too. Thanks @josef.warrick')).toEqual(['u2', 'u1']);
  });

  it('ignores case, trailing punctuation and unknown handles', () => {
    expect(ids('Ask @Helena.Brandt.')).toEqual(['u1']);
    expect(ids('(@tomas.ilvar), @nobody.here')).toEqual(['u3']);
  });

  it('does not read e-mail addresses or words with @ inside as mentions', () => {
    expect(ids('Write to helena.brandt@kestrelweir.example or x@josef.warrick')).toEqual([]);
    expect(ids('No mention here.')).toEqual([]);
  });
});

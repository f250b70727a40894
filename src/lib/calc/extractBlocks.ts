/**
 * Finds the calculation blocks of a markdown case body: fenced code blocks (``` or ~~~,
 * CommonMark §4.5) whose info string starts with a calculation word.
 */
import { isBlockWord } from './blockWords';

/** A fenced block before its body is parsed. */
export interface RawBlock {
  readonly word: string;
  /** Everything after the word in the info string, trimmed. */
  readonly rest: string;
  readonly line: number;
  readonly endLine: number;
  /** Body lines with their 1-based line numbers in the whole document. */
  readonly lines: readonly { readonly text: string; readonly line: number }[];
  /** False when the document ended before the closing fence. */
  readonly closed: boolean;
}

const OPEN = /^( {0,3})(`{3,}|~{3,})\s*([^`]*)$/;

/** Every calculation block in document order; other fenced blocks are skipped whole. */
export function extractBlocks(markdown: string): RawBlock[] {
  const lines = markdown.split(/\r\n|\r|\n/);
  const blocks: RawBlock[] = [];
  for (let i = 0; i < lines.length; i += 1) {
    const open = OPEN.exec(lines[i]!);
    if (!open) continue;
    const fence = open[2]!;
    const info = open[3]!.trim();
    const [word = '', ...rest] = info.split(/\s+/);
    const body: { text: string; line: number }[] = [];
    let j = i + 1;
    let closed = false;
    for (; j < lines.length; j += 1) {
      const text = lines[j]!;
      const trimmed = text.trim();
      if (trimmed.startsWith(fence[0]!.repeat(fence.length)) && /^([`~])\1*$/.test(trimmed) && trimmed[0] === fence[0]) {
        closed = true;
        break;
      }
      body.push({ text, line: j + 1 });
    }
    if (isBlockWord(word.toLowerCase())) {
      blocks.push({
        word: word.toLowerCase(),
        rest: rest.join(' '),
        line: i + 1,
        endLine: closed ? j + 1 : Math.max(i + 1, j),
        lines: body,
        closed,
      });
    }
    i = j;
  }
  return blocks;
}

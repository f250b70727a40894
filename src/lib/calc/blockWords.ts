/**
 * The calculation words of block info strings and the solver kind each one runs.
 * Short, plain words of the trade so that engineers type them fast; the solver's own kind
 * ids are accepted too. Stable: renaming a word breaks saved cases.
 */
export const BLOCK_WORDS = {
  jump: 'hydraulic-jump',
  surge: 'surge',
  bore: 'surge',
  dambreak: 'dam-break',
  toe: 'toe-depth',
  gate: 'sluice-gate',
  tailwater: 'tailwater-check',
  basin: 'stilling-basin',
} as const;

/** A calculation word of an info string. */
export type BlockWord = keyof typeof BLOCK_WORDS;

const SOLVER_IDS = new Set<string>(Object.values(BLOCK_WORDS));

/** True when an info string's first word opens a calculation block. */
export function isBlockWord(word: string): boolean {
  return Object.hasOwn(BLOCK_WORDS, word) || SOLVER_IDS.has(word);
}

/** The solver kind a block word runs. */
export function solverKindOf(word: string): string {
  return Object.hasOwn(BLOCK_WORDS, word) ? BLOCK_WORDS[word as BlockWord] : word;
}

/** The preferred block word of a solver kind (for templates and messages). */
export function blockWordOf(kind: string): string {
  return (Object.keys(BLOCK_WORDS) as BlockWord[]).find((w) => BLOCK_WORDS[w] === kind) ?? kind;
}

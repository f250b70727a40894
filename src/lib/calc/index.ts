export { BLOCK_WORDS, blockWordOf, isBlockWord, solverKindOf, type BlockWord } from './blockWords';
export { evaluateCase } from './evaluateCase';
export { solveJson, type InputIssue, type JsonInput, type JsonSolveResult } from './solveJson';
export { extractBlocks, type RawBlock } from './extractBlocks';
export { parseBlock, parseNumber } from './parseBlock';
export { MAX_LIST_LENGTH } from './resolveInputs';
export { EvaluateRequestSchema, JsonInputSchema, SolveRequestSchema, type SolveRequest } from './requests';
export type { BlockResult, BlockWarning, CaseEvaluation, ShownColumn, ShownValue } from './results';
export type { Assignment, BlockSource, LineIssue, ValueNode } from './syntax';

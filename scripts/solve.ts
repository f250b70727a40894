// `npm run solve -- FILE.json` (or `-` for standard input): batch calculations from the
// command line. The JSON is what POST /api/v1/solve takes — one request or an array of
// them — or {"markdown": "..."} as for /api/v1/evaluate. Results go to standard output as
// JSON. Exit 0 when everything solved, 2 with a message on standard error when some input
// is invalid (the results of the valid ones are still printed).
import { readFile } from 'node:fs/promises';
import { z } from 'zod';
import { EvaluateRequestSchema, evaluateCase, SolveRequestSchema, solveJson } from '../src/lib/calc';
import { DESIGN_AID_CAUTION } from '../src/lib/caution';

const usage = 'usage: npm run solve -- FILE.json   (or - to read standard input)';

async function readInput(arg: string | undefined): Promise<string> {
  if (!arg) throw new Error(usage);
  if (arg !== '-') return readFile(arg, 'utf8');
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const describe = (error: z.ZodError) => error.issues.map((i) => `${i.path.join('.') || '(top)'}: ${i.message}`).join('; ');

async function main(): Promise<number> {
  let text: string;
  try {
    text = await readInput(process.argv[2]);
  } catch (error) {
    console.error(error instanceof Error && 'code' in error ? `Cannot read ${process.argv[2]}: ${error.message}` : (error as Error).message);
    return 2;
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (error) {
    console.error(`The input is not JSON: ${(error as Error).message}`);
    return 2;
  }
  if (data !== null && typeof data === 'object' && !Array.isArray(data) && 'markdown' in data) {
    const parsed = EvaluateRequestSchema.safeParse(data);
    if (!parsed.success) {
      console.error(`Invalid input: ${describe(parsed.error)}`);
      return 2;
    }
    const evaluation = evaluateCase(parsed.data.markdown);
    console.log(JSON.stringify({ ...evaluation, caution: DESIGN_AID_CAUTION }, null, 2));
    const broken = evaluation.blocks.filter((b) => b.status === 'error');
    for (const b of broken) for (const e of b.errors) console.error(`line ${e.line}: ${e.message}${e.hint ? ` (${e.hint})` : ''}`);
    return broken.length ? 2 : 0;
  }
  const requests = Array.isArray(data) ? data : [data];
  let invalid = 0;
  const results = requests.map((request, index) => {
    const where = Array.isArray(data) ? `item ${index}: ` : '';
    const parsed = SolveRequestSchema.safeParse(request);
    if (!parsed.success) {
      invalid += 1;
      console.error(`${where}invalid request: ${describe(parsed.error)}`);
      return { ok: false, issues: parsed.error.issues.map((i) => ({ field: i.path.join('.'), message: i.message })) };
    }
    const outcome = solveJson(parsed.data.kind, parsed.data.inputs, parsed.data.units);
    if (!outcome.ok) {
      invalid += 1;
      for (const issue of outcome.issues) console.error(`${where}${issue.field}: ${issue.message}${issue.hint ? ` (${issue.hint})` : ''}`);
    }
    return outcome;
  });
  const output = Array.isArray(data) ? results : results[0];
  console.log(JSON.stringify({ results: output, caution: DESIGN_AID_CAUTION }, null, 2));
  return invalid ? 2 : 0;
}

process.exitCode = await main();

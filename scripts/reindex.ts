// `npm run reindex`: rebuilds the precedent-search index from PostgreSQL (every firm's
// published cases) into a fresh index and swaps it in, with a progress bar. Against the
// demo installation by default (npm start must have run once, so the search fake is up);
// DATABASE_URL and SEQUENT_SEARCH_URL / SEQUENT_SEARCH_KEY point it elsewhere.
// `--quiet` prints one line at the end (npm start uses it).
import './lib/load-env';
import { closeDb, pool } from '../src/db/client';
import { describeSearchError, reindexAll, searchService } from '../src/lib/search';

const quiet = process.argv.includes('--quiet');
const width = 30;
let lastDrawn = -1;

function draw(done: number, total: number): void {
  if (quiet) return;
  const share = total === 0 ? 1 : done / total;
  const percent = Math.floor(share * 100);
  if (process.stderr.isTTY) {
    const filled = Math.round(share * width);
    process.stderr.write(`\r  [${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${String(percent).padStart(3)} %  ${done} of ${total} cases`);
  } else if (percent >= lastDrawn + 10 || done === total) {
    // No terminal (CI logs): a line every tenth.
    console.error(`  ${percent} %  ${done} of ${total} cases`);
  }
  lastDrawn = percent;
}

try {
  const service = searchService();
  if (!service) throw new Error('SEQUENT_SEARCH_URL is not set: there is no search service to rebuild.');
  if (!quiet) console.error(`Rebuilding the search index ${service.indexUid} from PostgreSQL…`);
  const result = await reindexAll(pool(), service, draw);
  if (!quiet && process.stderr.isTTY) process.stderr.write('\n');
  console.log(`Search index rebuilt: ${result.indexed} published case(s) in ${(result.ms / 1000).toFixed(1)} s.`);
} catch (error) {
  if (!quiet && process.stderr.isTTY) process.stderr.write('\n');
  console.error(`Reindex failed: ${describeSearchError(error)}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}

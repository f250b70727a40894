import { evaluateCase } from '../src/lib/calc';
const body = [
'```tailwater check', 'b = 25 m', 'Q = 40 to 280 m3/s step 40', 'toe = head', 'H = 12.0 m', 'rating:', '  Q m3/s | TW m', '  0 | 1.0', '  300 | 6.0', '```', '',
'```basin pick', 'Q = check.Q', 'b = check.b', 'y1 = check.y1', 'TW = check.TW', '```', ''].join('\n');
const r = evaluateCase(body);
for (const b of r.blocks) console.log(b.name, b.status, JSON.stringify(b.errors), b.outputs.map(o=>`${o.symbol}=${o.text}${o.unit}`).join(' '), '\n', b.warnings.map(w=>w.message).join('\n '), '\n', b.table?.text.map(r=>r.join(' | ')).join('\n'));

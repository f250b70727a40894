/**
 * A case's calculations as files: CSV rows of every block's inputs and results (RFC 4180,
 * formula-guarded through the audit trail's `csvRow`) and the whole case as JSON. Pure:
 * the routes gather the facts and send the text.
 */
import type { AttachmentView } from '../attachments';
import { csvRow } from '../audit';
import type { BlockResult, CaseEvaluation, ShownValue } from '../calc/results';
import { DESIGN_AID_CAUTION } from '../caution';
import type { SheetCase } from './load';

/** What a file names besides the evaluation. */
export interface ExportFacts {
  firmName: string;
  sheet: SheetCase;
  evaluation: CaseEvaluation;
  /** Method notes used, by slug: title and sources (from content/methods). */
  methods: readonly MethodUsed[];
}

/** A method note a block relies on. */
export interface MethodUsed {
  slug: string;
  title: string;
  sources: readonly string[];
}

/** The CSV header row. */
export const CSV_COLUMNS = ['block', 'block title', 'block name', 'kind', 'section', 'row', 'name', 'symbol', 'value', 'unit', 'SI value'] as const;

const siText = (si: ShownValue['si']): string => (si === null ? '' : Array.isArray(si) ? si.join(' ') : String(si));

function blockRows(block: BlockResult): unknown[][] {
  const head = [block.index + 1, block.title, block.name ?? '', block.kind];
  const rows: unknown[][] = [];
  for (const v of block.inputs) rows.push([...head, 'input', '', v.name, v.symbol, v.text, v.unit, siText(v.si)]);
  for (const v of block.outputs) rows.push([...head, 'output', '', v.name, v.symbol, v.text, v.unit, siText(v.si)]);
  if (block.table) {
    const { columns, rows: values, text } = block.table;
    values.forEach((row, r) =>
      columns.forEach((column, c) => rows.push([...head, 'table', r + 1, column.name, column.symbol, text[r]?.[c] ?? '', column.unit, row[c] ?? ''])),
    );
  }
  for (const issue of block.errors) rows.push([...head, 'error', '', `line ${issue.line}`, '', issue.message, '', '']);
  return rows;
}

/**
 * One row per file of the revision, in the block columns: block title = caption, block
 * name = uploaded by, kind = detected type, section `attachment`, row = 1, 2, …, name =
 * file name, symbol `sha256`, value = the SHA-256 (hex), SI value = the size in bytes.
 */
function attachmentRows(attachments: readonly AttachmentView[]): unknown[][] {
  return attachments.map((a, i) => ['', a.caption, a.uploaderName, a.contentType, 'attachment', i + 1, a.fileName, 'sha256', a.sha256, '', a.size]);
}

/** The files of the exported revision as the JSON export lists them. */
export function attachmentsJson(attachments: readonly AttachmentView[]) {
  return attachments.map((a) => ({
    fileName: a.fileName,
    contentType: a.contentType,
    size: a.size,
    sha256: a.sha256,
    caption: a.caption,
    uploadedBy: a.uploaderName,
    addedInRevision: a.addedInRevision,
    url: a.url,
  }));
}

/** The file name of an export or sheet of revision `revision` of the case `slug`. */
export const exportFileName = (slug: string, revision: number, extension: string) => `${slug}-rev${revision}.${extension}`;

/**
 * The CSV text: two comment rows (what the file is with the caution; the case, firm, project,
 * revision and solver, each value in its own guarded cell), the header, then one row
 * per input, result and table cell of every block, in block order, then one `attachment` row
 * per file of the revision (see {@link attachmentRows}).
 */
export function caseCsv({ firmName, sheet, evaluation }: ExportFacts): string {
  const { case: found, revision } = sheet;
  let text = csvRow([`# Sequent calculation export. ${DESIGN_AID_CAUTION}`]);
  text += csvRow(['# case', found.title, 'firm', firmName, 'project', found.projectReference ?? '', 'revision', revision.number, 'solver', evaluation.solverVersion]);
  text += csvRow(CSV_COLUMNS);
  for (const block of evaluation.blocks) for (const row of blockRows(block)) text += csvRow(row);
  for (const row of attachmentRows(sheet.attachments)) text += csvRow(row);
  return text;
}

/** The whole case as one JSON document. */
export function caseJson({ firmName, sheet, evaluation, methods }: ExportFacts) {
  const { case: found, revision, signoff } = sheet;
  return {
    format: 'sequent-case-export/1',
    firm: firmName,
    case: {
      id: found.id,
      slug: found.slug,
      title: found.title,
      projectReference: found.projectReference,
      structureType: found.structureType,
      sectionShape: found.sectionShape,
      summary: found.summary,
      region: found.region,
      tags: found.tags,
      state: found.state,
      author: found.authorName,
      latestRevision: found.latestRevision,
      publishedRevision: found.publishedRevision,
    },
    revision: {
      number: revision.number,
      author: revision.authorName,
      createdAt: revision.createdAt.toISOString(),
      savedWithSolver: revision.solverVersion,
      body: revision.body,
    },
    checkedBy: signoff.checkedBy.map((a) => ({ name: a.reviewerName, at: a.createdAt.toISOString(), solverVersion: a.solverVersion })),
    approvedBy: signoff.approvedBy ? { name: signoff.approvedBy.reviewerName, at: signoff.approvedBy.createdAt.toISOString() } : null,
    solverVersion: evaluation.solverVersion,
    evaluation,
    methods,
    attachments: attachmentsJson(sheet.attachments),
    caution: DESIGN_AID_CAUTION,
  };
}

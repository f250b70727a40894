export { chooseRevision, PAPER_SIZES, paperOf, type PaperSize, type RevisionChoiceFacts } from './choose';
export { getSheetSignoff, type SheetApproval, type SheetSignoff } from './signoff';
export { getSheetCase, sheetFilesLoader, type SheetCase, type SheetRevision, type SheetViewer } from './load';
export { attachmentsJson, caseCsv, caseJson, CSV_COLUMNS, exportFileName, type ExportFacts, type MethodUsed } from './exports';

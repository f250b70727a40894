export { chromiumPath, closePdfBrowser, pdfBrowser } from './chromium';
export { footerTemplate, PDF_TIMEOUT_MS, renderPdf, type PdfFormat, type PdfRequest, type PdfResult } from './render';

export { studyReportOf } from './studyReport.ts';
export type { ReportBlock, ReportSection, StudyReport, StudyReportOptions } from './studyReport.ts';
export { markdownOfReport, escapeMarkdown } from './reportMarkdown.ts';
export type { MarkdownReport } from './reportMarkdown.ts';
export { htmlOfReport } from './reportHtml.ts';
export { reportPagesOf, pageDefaults } from './reportPages.ts';
export type { PageSetup, ReportPage } from './reportPages.ts';
export { pdfOfReport } from './reportPdf.ts';

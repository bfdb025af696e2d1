/**
 * The export formats and what a download of each is called and typed as. Kept apart from the
 * writers (export-formats.ts): the request thread needs only these names, and the writers pull in
 * web-ifc, the spreadsheet and the PDF libraries, which only the export worker threads load.
 */
export const EXPORT_FORMATS = ['csv', 'xlsx', 'pdf', 'bcf', 'ifc'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export const FORMAT_INFO: Record<ExportFormat, { extension: string; contentType: string }> = {
  csv: { extension: 'csv', contentType: 'text/csv; charset=utf-8' },
  xlsx: { extension: 'xlsx', contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' },
  pdf: { extension: 'pdf', contentType: 'application/pdf' },
  bcf: { extension: 'bcfzip', contentType: 'application/octet-stream' },
  ifc: { extension: 'ifc', contentType: 'application/x-step' },
};

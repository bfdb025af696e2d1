/**
 * The export formats: file extension, content type and writer of each. Routes and the
 * command line both go through `writeExport`, so a format behaves the same everywhere.
 */
import type { ExportBundle } from './export-bundle';
import { writeCsv } from './csv-export';
import { writeXlsx } from './xlsx-export';
import { writePdfReport } from './pdf-report';
import { writeBcf } from './bcf-export';
import { writeIfcWithResults } from './ifc-export';

export const EXPORT_FORMATS = ['csv', 'xlsx', 'pdf', 'bcf', 'ifc'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export const FORMAT_INFO: Record<ExportFormat, { extension: string; contentType: string }> = {
  csv: { extension: 'csv', contentType: 'text/csv; charset=utf-8' },
  xlsx: { extension: 'xlsx', contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' },
  pdf: { extension: 'pdf', contentType: 'application/pdf' },
  bcf: { extension: 'bcfzip', contentType: 'application/octet-stream' },
  ifc: { extension: 'ifc', contentType: 'application/x-step' },
};

export interface ExportSource {
  /** The uploaded model's IFC bytes; only the IFC export asks for them. */
  modelBytes?: () => Promise<Uint8Array>;
}

export async function writeExport(format: ExportFormat, bundle: ExportBundle, source: ExportSource = {}): Promise<Buffer> {
  switch (format) {
    case 'csv':
      return writeCsv(bundle);
    case 'xlsx':
      return writeXlsx(bundle);
    case 'pdf':
      return writePdfReport(bundle);
    case 'bcf':
      return writeBcf(bundle);
    case 'ifc': {
      if (!source.modelBytes) throw new Error('The IFC export needs the uploaded model.');
      return writeIfcWithResults(await source.modelBytes(), bundle);
    }
  }
}

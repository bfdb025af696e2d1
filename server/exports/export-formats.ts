/**
 * The writer of each export format (names and content types: export-format-info.ts). The export
 * worker threads and the command line both go through `writeExport`, so a format behaves the
 * same everywhere.
 */
import type { ExportBundle } from './export-bundle';
import { writeCsv } from './csv-export';
import { writeXlsx } from './xlsx-export';
import { writePdfReport } from './pdf-report';
import { writeBcf } from './bcf-export';
import { writeIfcWithResults } from './ifc-export';
import type { ExportFormat } from './export-format-info';

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

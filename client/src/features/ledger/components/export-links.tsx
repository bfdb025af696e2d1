import { apiPath } from '../../../lib/api-client';

const FORMATS = [
  { id: 'csv', label: 'CSV', title: 'Member table as comma-separated values' },
  { id: 'xlsx', label: 'XLSX', title: 'Member table as a spreadsheet' },
  { id: 'pdf', label: 'PDF', title: 'Report with member sheets and cautions' },
  { id: 'bcf', label: 'BCF', title: 'Issues for a BIM coordination tool' },
  { id: 'ifc', label: 'IFC', title: 'The model with results written back as properties' },
] as const;

/** Links to the exports of the members in the current view (same filters as the table). */
export function ExportLinks({ projectId, revisionId, filters }: { projectId: number; revisionId: number; filters: Record<string, string> }) {
  const search = new URLSearchParams(filters).toString();
  return (
    <nav aria-label="Export the members shown" className="no-print flex flex-wrap items-center gap-2 text-small">
      <span className="ledger-label">Export</span>
      {FORMATS.map((f) => (
        <a
          key={f.id}
          href={`${apiPath`/api/projects/${projectId}/revisions/${revisionId}/exports/${f.id}`}${search ? `?${search}` : ''}`}
          title={f.title}
          download
          className="rounded-control border border-edge bg-card px-2.5 py-1 font-semibold text-ink no-underline hover:bg-ledger hover:no-underline"
        >
          {f.label}
        </a>
      ))}
    </nav>
  );
}

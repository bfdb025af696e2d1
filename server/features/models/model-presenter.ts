import type { IfcModel, Revision, RevisionSummary } from '@shared/api/models';
import type { IfcModelModel } from '../../db/models/ifc-model';
import type { RevisionModel } from '../../db/models/revision';

export function presentRevision(r: RevisionModel, uploadedBy: string | null): Revision {
  return {
    id: r.id,
    modelId: r.modelId,
    number: r.number,
    fileName: r.fileName,
    fileSize: Number(r.fileSize),
    sha256: r.sha256,
    standard: r.standard,
    status: r.status,
    progress: Math.max(0, Math.min(1, r.progress ?? 0)),
    failure: r.status === 'failed' ? { error: r.failureId ?? 'import.failed', message: r.failureMessage ?? 'The import failed.' } : null,
    uploadedBy,
    summary: (r.summary as RevisionSummary | null) ?? null,
    createdAt: r.createdAt.toISOString(),
    finishedAt: r.finishedAt ? r.finishedAt.toISOString() : null,
  };
}

export function presentModel(m: IfcModelModel, latest: Revision | null, revisionCount: number): IfcModel {
  return { id: m.id, projectId: m.projectId, name: m.name, latestRevision: latest, revisionCount };
}

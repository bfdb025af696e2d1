// What the rest of the app may use from the models feature.
export { ModelsList } from './components/models-panel';
export { UploadForm } from './components/upload-form';
export { useModels } from './api/use-models';
export { useRevision } from './api/use-revision';
export { useRevisions } from './api/use-revisions';
export { JobReport, JobStatusBadge } from './components/job-status';

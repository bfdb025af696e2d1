import { useId, useRef, useState, type DragEvent } from 'react';
import { useFocusAfterRender } from '../../../lib/focus-after-render';
import { Link } from 'react-router';
import { MODEL_NAME_MAX, type IfcModel, type UploadResponse } from '@shared/api';
import { errorMessage } from '../../../lib/api-client';
import { formatCount } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { cx } from '../../../lib/cx';
import { Button, Notice, TextField } from '../../../ui';
import { FieldError } from '../../../ui/field-parts';
import { useUploadModel } from '../api/use-upload-model';
import { useRevision } from '../api/use-revision';
import { JobReport, ProgressBar } from './job-status';

const ACCEPT = '.ifc,.ifczip';
const isIfcName = (name: string) => /\.(ifc|ifczip)$/i.test(name);

function sizeText(bytes: number): string {
  if (bytes < 1024) return `${formatCount(bytes)} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} KB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/**
 * Upload an IFC model (engineers and admins). Pick a file or drop it on the form,
 * optionally name the model, send it with a progress bar, then follow the import job
 * until it is checked or has failed.
 */
export function UploadForm({ projectId, models }: { projectId: number; models: readonly IfcModel[] }) {
  const upload = useUploadModel(projectId);
  const [file, setFile] = useState<File | null>(null);
  const [modelName, setModelName] = useState('');
  const [fileError, setFileError] = useState<string | null>(null);
  const [nameError, setNameError] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const [answer, setAnswer] = useState<UploadResponse | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const { ref: noticeRef, requestFocus: focusNotice } = useFocusAfterRender<HTMLDivElement>();
  const ids = { file: useId(), hint: useId(), error: useId(), list: useId(), form: useId() };

  const choose = (picked: File | null) => {
    setFile(picked);
    setFailure(null);
    setFileError(picked && !isIfcName(picked.name) ? 'Choose an IFC file: its name ends in .ifc or .ifczip.' : null);
  };

  const onDrop = (event: DragEvent<HTMLElement>) => {
    event.preventDefault();
    setDragging(false);
    const dropped = event.dataTransfer.files?.[0] ?? null;
    if (dropped) {
      choose(dropped);
      // Keep the input in step so the form reads the same whichever way the file came.
      if (inputRef.current) {
        const transfer = new DataTransfer();
        transfer.items.add(dropped);
        inputRef.current.files = transfer.files;
      }
    }
  };

  const submit = async () => {
    setFailure(null);
    setAnswer(null);
    const name = modelName.trim();
    let bad = false;
    if (!file) {
      setFileError('Choose an IFC file to upload.');
      bad = true;
    } else if (!isIfcName(file.name)) {
      setFileError('Choose an IFC file: its name ends in .ifc or .ifczip.');
      bad = true;
    }
    if (name.length > MODEL_NAME_MAX) {
      setNameError(`Keep the model name to ${MODEL_NAME_MAX} characters.`);
      bad = true;
    } else setNameError(null);
    if (bad || !file) {
      inputRef.current?.focus();
      return;
    }
    try {
      const result = await upload.mutateAsync({ file, modelName: name || undefined });
      setAnswer(result);
      setFile(null);
      setModelName('');
      if (inputRef.current) inputRef.current.value = '';
    } catch (error) {
      setFailure(errorMessage(error));
      focusNotice();
    }
  };

  const sending = upload.isPending;
  const sentPct = upload.sent && upload.sent.total > 0 ? upload.sent.loaded / upload.sent.total : 0;

  return (
    <div className="flex flex-col gap-4">
      <form
        aria-label="Upload a model"
        noValidate
        onSubmit={(event) => {
          event.preventDefault();
          void submit();
        }}
        onDragOver={(event) => {
          event.preventDefault();
          setDragging(true);
        }}
        onDragLeave={(event) => {
          if (!event.currentTarget.contains(event.relatedTarget as Node | null)) setDragging(false);
        }}
        onDrop={onDrop}
        className="flex flex-col gap-4"
      >
        {failure && (
          <Notice ref={noticeRef} tone="error" title="The model was not uploaded">
            {failure}
          </Notice>
        )}
        <div className="flex flex-col gap-1.5">
          <label htmlFor={ids.file} className="block text-small font-semibold text-ink">
            IFC file
          </label>
          <div
            className={cx(
              'flex flex-col gap-2 rounded-card border-2 border-dashed px-4 py-4 text-small transition-colors',
              dragging ? 'border-copper bg-copper-wash' : fileError ? 'border-fault' : 'border-edge/60 bg-ledger/50',
            )}
          >
            <input
              ref={inputRef}
              id={ids.file}
              name="file"
              type="file"
              accept={ACCEPT}
              aria-invalid={fileError ? true : undefined}
              aria-describedby={cx(ids.hint, fileError && ids.error)}
              onChange={(event) => choose(event.target.files?.[0] ?? null)}
              className="text-small file:mr-3 file:rounded-control file:border file:border-edge file:bg-card file:px-3 file:py-1 file:font-semibold file:text-ink hover:file:bg-ledger"
            />
            <p id={ids.hint} className="text-muted">
              {file ? (
                <>
                  <span className="font-semibold text-ink">{file.name}</span>, {sizeText(file.size)}
                </>
              ) : (
                <>Choose a .ifc or .ifczip file, or drop one here.</>
              )}
            </p>
          </div>
          {fileError && <FieldError id={ids.error}>{fileError}</FieldError>}
        </div>
        <TextField
          label="Model name"
          optional
          name="modelName"
          value={modelName}
          onChange={(event) => setModelName(event.target.value)}
          error={nameError ?? undefined}
          list={ids.list}
          autoComplete="off"
          description="Leave empty to name the model after the file. Use an existing model's name to add a new revision to it."
        />
        <datalist id={ids.list}>
          {models.map((m) => (
            <option key={m.id} value={m.name} />
          ))}
        </datalist>
        {sending && (
          <div className="flex flex-col gap-1.5" aria-live="polite">
            <p className="flex justify-between text-small">
              <span className="font-semibold">Sending the file…</span>
              <span className="figures text-muted">{Math.round(sentPct * 100)} %</span>
            </p>
            <ProgressBar value={sentPct} label="Upload" />
          </div>
        )}
        <div>
          <Button type="submit" busy={sending}>
            Upload and check
          </Button>
        </div>
      </form>
      {answer && <UploadOutcome projectId={projectId} answer={answer} models={models} />}
    </div>
  );
}

function UploadOutcome({ projectId, answer, models }: { projectId: number; answer: UploadResponse; models: readonly IfcModel[] }) {
  const live = useRevision(projectId, answer.revision.id);
  const revision = live.data ?? answer.revision;
  const model = models.find((m) => m.id === revision.modelId);
  if (answer.duplicateOf !== null) {
    return (
      <Notice tone="info" title="Already uploaded">
        This file is byte for byte the same as revision {revision.number}
        {model ? ` of ${model.name}` : ''}, so nothing new was checked.{' '}
        <Link to={paths.revision(projectId, revision.id)}>Open revision {revision.number}</Link>
      </Notice>
    );
  }
  return (
    <section aria-label="Import progress" className="rounded-card border border-rule px-4 py-3">
      <p className="mb-2 text-small text-muted">
        {revision.fileName} → {model ? model.name : 'model'}, revision {revision.number}
      </p>
      <JobReport projectId={projectId} revision={revision} />
    </section>
  );
}

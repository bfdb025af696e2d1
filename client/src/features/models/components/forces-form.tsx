import { useId, useRef, useState } from 'react';
import { useFocusAfterRender } from '../../../lib/focus-after-render';
import type { ForcesReportBody } from '@shared/api';
import { errorMessage } from '../../../lib/api-client';
import { formatCount } from '../../../lib/format';
import { Button, Notice, Table, TBody, Td, Th, THead, Tr } from '../../../ui';
import { FieldError } from '../../../ui/field-parts';
import { forcesProblems, useApplyForces, type ForcesProblem } from '../api/use-apply-forces';

/**
 * Apply a forces file (CSV) to a checked revision. The server applies all rows or
 * none; a refusal comes with the line and reason of every problem, listed here.
 */
export function ForcesForm({ projectId, revisionId, revisionNumber }: { projectId: number; revisionId: number; revisionNumber: number }) {
  const apply = useApplyForces(projectId, revisionId);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [report, setReport] = useState<ForcesReportBody | null>(null);
  const [failure, setFailure] = useState<{ message: string; problems: ForcesProblem[] } | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const { ref: noticeRef, requestFocus: focusNotice } = useFocusAfterRender<HTMLDivElement>();
  const ids = { file: useId(), hint: useId(), error: useId() };

  const submit = async () => {
    setReport(null);
    setFailure(null);
    if (!file) {
      setFileError('Choose a forces file (.csv).');
      inputRef.current?.focus();
      return;
    }
    setFileError(null);
    try {
      const text = await file.text();
      if (!text.trim()) {
        setFileError('That file is empty.');
        inputRef.current?.focus();
        return;
      }
      setReport(await apply.mutateAsync(text));
      setFile(null);
      if (inputRef.current) inputRef.current.value = '';
    } catch (error) {
      setFailure({ message: errorMessage(error), problems: forcesProblems(error) });
    }
    focusNotice();
  };

  return (
    <form
      aria-label={`Forces for revision ${revisionNumber}`}
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
    >
      <div className="flex flex-col gap-1.5">
        <label htmlFor={ids.file} className="text-small font-semibold">
          Forces file
        </label>
        <p id={ids.hint} className="text-small text-muted">
          A CSV with one row per member and load case, headed <code className="font-mono">GlobalId,LoadCase,N [kN]</code> (or a Tag
          column, and N [kip] or N [N]); axial force tension positive. Every row must match a member, or nothing is applied.
        </p>
        <input
          ref={inputRef}
          id={ids.file}
          type="file"
          accept=".csv,text/csv,text/plain"
          aria-invalid={fileError ? true : undefined}
          aria-describedby={[ids.hint, fileError ? ids.error : ''].filter(Boolean).join(' ')}
          onChange={(event) => {
            setFile(event.target.files?.[0] ?? null);
            setFileError(null);
          }}
          className="text-small file:mr-3 file:rounded-control file:border file:border-edge file:bg-card file:px-3 file:py-1 file:font-semibold file:text-ink hover:file:bg-ledger"
        />
        {fileError && <FieldError id={ids.error}>{fileError}</FieldError>}
      </div>
      <div>
        <Button type="submit" variant="secondary" busy={apply.isPending}>
          Apply forces
        </Button>
      </div>
      {report && (
        <Notice ref={noticeRef} tone="success" title="Forces applied">
          {formatCount(report.rows)} rows for {formatCount(report.members)} members (forces in {report.unit}); {formatCount(report.rechecked)}{' '}
          members checked again.
        </Notice>
      )}
      {failure && (
        <Notice ref={noticeRef} tone="error" title="The forces file was not applied">
          <p>{failure.message}</p>
          {failure.problems.length > 0 && (
            <Table caption="Problems in the forces file" className="mt-2 max-h-72 overflow-y-auto bg-card">
              <THead>
                <tr>
                  <Th numeric>Line</Th>
                  <Th>Problem</Th>
                </tr>
              </THead>
              <TBody>
                {failure.problems.map((p, i) => (
                  <Tr key={`${p.line}-${i}`}>
                    <Td numeric>{p.line}</Td>
                    <Td>{p.message}</Td>
                  </Tr>
                ))}
              </TBody>
            </Table>
          )}
        </Notice>
      )}
    </form>
  );
}

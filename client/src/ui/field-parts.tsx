import type { ReactNode } from 'react';

/** Label, description and error parts shared by TextField and Select. */

export function FieldLabel({ htmlFor, children, optional }: { htmlFor: string; children: ReactNode; optional?: boolean }) {
  return (
    <label htmlFor={htmlFor} className="block text-small font-semibold text-ink">
      {children}
      {optional && <span className="ml-1.5 font-normal text-muted">(optional)</span>}
    </label>
  );
}

export function FieldDescription({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="text-small text-muted">
      {children}
    </p>
  );
}

export function FieldError({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-small font-semibold text-fault">
      <svg aria-hidden="true" viewBox="0 0 16 16" className="mt-0.5 size-4 shrink-0" fill="currentColor">
        <path d="M8 1.5 15 14H1L8 1.5Zm-.75 4.5v4h1.5V6h-1.5Zm0 5.25v1.5h1.5v-1.5h-1.5Z" />
      </svg>
      <span>
        <span className="sr-only">Problem: </span>
        {children}
      </span>
    </p>
  );
}

export const controlClass =
  'block w-full rounded-control border bg-card px-3 text-body text-ink placeholder:text-muted/80 ' +
  'disabled:bg-ledger disabled:text-muted aria-invalid:border-fault aria-invalid:border-2';

export function describedBy(...ids: Array<string | false | undefined>): string | undefined {
  const list = ids.filter(Boolean).join(' ');
  return list || undefined;
}

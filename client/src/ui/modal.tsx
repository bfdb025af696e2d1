import { useEffect, useId, useRef, type ReactNode } from 'react';
import { cx } from '../lib/cx';
import { Button } from './button';

interface ModalProps {
  open: boolean;
  title: string;
  description?: ReactNode;
  onClose: () => void;
  children: ReactNode;
  /** Wider sheet for forms with several columns. */
  wide?: boolean;
}

/**
 * A titled sheet over the page for a task with its own form (the native modal
 * <dialog>: focus stays inside, Escape closes). Focus starts on the element marked
 * data-autofocus, and goes back to whatever opened the sheet when it closes.
 */
export function Modal({ open, title, description, onClose, children, wide }: ModalProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const opener = useRef<HTMLElement | null>(null);
  const titleId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      opener.current = document.activeElement instanceof HTMLElement ? document.activeElement : null;
      dialog.showModal();
      // Start at the control the content marks (data-autofocus), else the browser's first focusable one.
      dialog.querySelector<HTMLElement>('[data-autofocus]')?.focus();
    }
    if (!open && dialog.open) {
      dialog.close();
      opener.current?.focus();
    }
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(event) => {
        event.preventDefault();
        onClose();
      }}
      className={cx(
        'm-auto max-h-[calc(100vh-2rem)] rounded-card border border-rule bg-card p-0 text-ink shadow-[0_8px_30px_rgb(28_36_48/0.18)] backdrop:bg-ink/30',
        wide ? 'w-[min(48rem,calc(100vw-2rem))]' : 'w-[min(32rem,calc(100vw-2rem))]',
      )}
    >
      {open && (
        <>
          <header className="flex items-start justify-between gap-4 border-b border-rule px-5 py-4">
            <div className="min-w-0">
              <h2 id={titleId} className="text-title font-semibold">
                {title}
              </h2>
              {description && <div className="mt-1 text-small text-muted">{description}</div>}
            </div>
            <Button variant="quiet" size="sm" onClick={onClose}>
              Close
            </Button>
          </header>
          <div className="px-5 py-4">{children}</div>
        </>
      )}
    </dialog>
  );
}

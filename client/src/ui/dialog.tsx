import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button, type ButtonVariant } from './button';

interface ConfirmDialogProps {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  confirmVariant?: ButtonVariant;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}

/**
 * Asks before a consequential change. Built on the native modal <dialog>: focus is
 * trapped inside, Escape cancels, and focus returns to where it was on close.
 */
export function ConfirmDialog({ open, title, children, confirmLabel, confirmVariant = 'primary', busy, onConfirm, onCancel }: ConfirmDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={children ? bodyId : undefined}
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-card border border-rule bg-card p-0 text-ink shadow-[0_8px_30px_rgb(28_36_48/0.18)]"
    >
      <div className="px-5 py-4">
        <h2 id={titleId} className="text-title font-semibold">
          {title}
        </h2>
        {children && (
          <div id={bodyId} className="mt-2 text-small text-ink">
            {children}
          </div>
        )}
      </div>
      <div className="flex justify-end gap-2 border-t border-rule bg-ledger px-5 py-3">
        <Button variant="secondary" onClick={onCancel} disabled={busy} autoFocus>
          Cancel
        </Button>
        <Button variant={confirmVariant} onClick={onConfirm} busy={busy}>
          {confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}

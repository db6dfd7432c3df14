import { useId, type ReactNode } from 'react';
import { Button } from './button';
import { useModalDialog } from './modal';

/**
 * A modal question with a cancel and a confirm button, on the native <dialog> element
 * (focus is trapped and Escape closes it without extra code).
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  cancelLabel = 'Cancel',
  pending = false,
  tone = 'danger',
  onConfirm,
  onClose,
}: {
  open: boolean;
  title: string;
  children?: ReactNode;
  confirmLabel: string;
  cancelLabel?: string;
  pending?: boolean;
  tone?: 'danger' | 'primary';
  onConfirm: () => void;
  onClose: () => void;
}) {
  const ref = useModalDialog(open);
  const titleId = useId();
  const bodyId = useId();

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={children ? bodyId : undefined}
      onClose={onClose}
      onCancel={(event) => {
        if (pending) event.preventDefault();
      }}
      className="m-auto w-[min(30rem,calc(100vw-2rem))] rounded-lg border border-rule bg-sheet p-0 text-ink shadow-2xl backdrop:bg-ink/60"
    >
      {open && (
        <div className="flex flex-col gap-3 p-5">
          <h2 id={titleId} className="text-xl font-bold">
            {title}
          </h2>
          {children && (
            <div id={bodyId} className="text-[15px] text-ink-2">
              {children}
            </div>
          )}
          <div className="mt-2 flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
            <Button variant="secondary" onClick={onClose} disabled={pending}>
              {cancelLabel}
            </Button>
            <Button variant={tone} onClick={onConfirm} pending={pending}>
              {confirmLabel}
            </Button>
          </div>
        </div>
      )}
    </dialog>
  );
}

import { useEffect, useId, useRef, type ReactNode, type RefObject } from 'react';
import { X } from 'lucide-react';

/** Opens and closes a native <dialog> as `open` changes (showModal: focus trapped, Escape closes). */
export function useModalDialog(open: boolean): RefObject<HTMLDialogElement | null> {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return ref;
}

/**
 * A modal panel on the native <dialog> (focus trapped, Escape closes). On a phone it takes
 * the whole screen so a long form scrolls with the keyboard up; from 640 px it is a centred sheet.
 * The close button is 48 px: these forms are used in the garage, on a phone.
 */
export function Modal({
  open,
  title,
  description,
  onClose,
  busy = false,
  wide = false,
  children,
}: {
  open: boolean;
  title: string;
  description?: ReactNode;
  onClose: () => void;
  /** While saving, Escape and the close button do nothing. */
  busy?: boolean;
  wide?: boolean;
  children: ReactNode;
}) {
  const ref = useModalDialog(open);
  const titleId = useId();

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={onClose}
      onCancel={(event) => {
        if (busy) event.preventDefault();
      }}
      className={
        'm-0 h-dvh max-h-none w-full max-w-none bg-paper p-0 text-ink backdrop:bg-ink/60 ' +
        'sm:m-auto sm:h-auto sm:max-h-[calc(100dvh-3rem)] sm:rounded-lg sm:border sm:border-rule sm:shadow-2xl ' +
        (wide ? 'sm:w-[min(60rem,calc(100vw-3rem))]' : 'sm:w-[min(44rem,calc(100vw-3rem))]')
      }
    >
      {open && (
        <div className="flex min-h-full flex-col">
          <div className="sticky top-0 z-10 flex items-start justify-between gap-3 border-b border-rule bg-sheet px-4 py-2 sm:px-5">
            <div className="min-w-0 py-2">
              <h2 id={titleId} className="text-xl leading-tight font-bold break-words">
                {title}
              </h2>
              {description && <div className="mt-0.5 text-[15px] text-muted">{description}</div>}
            </div>
            <button
              type="button"
              aria-label="Close"
              disabled={busy}
              onClick={onClose}
              className="-mr-2 inline-flex size-12 shrink-0 items-center justify-center rounded-md text-ink-2 hover:bg-ink/5 disabled:opacity-50"
            >
              <X aria-hidden className="size-6" />
            </button>
          </div>
          <div className="flex-1 px-4 py-4 sm:px-5">{children}</div>
        </div>
      )}
    </dialog>
  );
}

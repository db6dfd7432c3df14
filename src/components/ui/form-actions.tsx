import type { ReactNode } from 'react';
import { Alert } from './alert';
import { Button, ButtonLink } from './button';
import { FormError } from './form-error';

const layouts = {
  /** The usual footer: Submit on the right, Cancel beside it (stacked at phone width, Submit on top). */
  end: 'flex flex-col-reverse gap-2 sm:flex-row sm:justify-end',
  /** A form inside a page section: Submit first, at the left. */
  start: 'flex flex-wrap gap-2',
  /** A long form in a dialog: the footer stays at the bottom of the dialog while it scrolls. */
  sticky:
    'sticky bottom-0 -mx-4 flex flex-col-reverse gap-2 border-t border-rule bg-paper px-4 py-3 sm:-mx-5 sm:flex-row sm:justify-end sm:px-5',
} as const;

/**
 * The one footer of a form: its form-level error, an optional note of success, then Cancel (a
 * button or a link) and Submit with its pending state. Submit submits the form, or calls
 * `onSubmit` when the footer sits outside one. Cancel is disabled while the form sends.
 */
export function FormActions({
  submitLabel,
  pending = false,
  error,
  notice,
  onCancel,
  cancelHref,
  cancelLabel = 'Cancel',
  layout = 'end',
  large = false,
  submitIcon,
  submitVariant = 'primary',
  submitDisabled,
  onSubmit,
}: {
  submitLabel: ReactNode;
  pending?: boolean;
  /** The form-level error (not tied to one field). */
  error?: string;
  /** Said once the form has done its work, e.g. "Saved." */
  notice?: ReactNode;
  onCancel?: () => void;
  cancelHref?: string;
  cancelLabel?: string;
  layout?: keyof typeof layouts;
  /** 48 px buttons, for forms used with gloves on in the garage. */
  large?: boolean;
  submitIcon?: ReactNode;
  submitVariant?: 'primary' | 'secondary';
  submitDisabled?: boolean;
  onSubmit?: () => void;
}) {
  const size = large ? 'min-h-12!' : undefined;
  const cancel = cancelHref ? (
    <ButtonLink to={cancelHref} variant="secondary" className={size}>
      {cancelLabel}
    </ButtonLink>
  ) : (
    onCancel && (
      <Button variant="secondary" className={size} onClick={onCancel} disabled={pending}>
        {cancelLabel}
      </Button>
    )
  );
  const submit = (
    <Button
      type={onSubmit ? 'button' : 'submit'}
      onClick={onSubmit}
      variant={submitVariant}
      className={size}
      pending={pending}
      disabled={submitDisabled}
      icon={submitIcon}
    >
      {submitLabel}
    </Button>
  );
  return (
    <>
      <FormError message={error} />
      {notice && <Alert tone="ok">{notice}</Alert>}
      <div className={layouts[layout]}>
        {layout === 'start' && submit}
        {cancel}
        {layout !== 'start' && submit}
      </div>
    </>
  );
}

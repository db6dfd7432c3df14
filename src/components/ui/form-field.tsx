import {
  useId,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
  type Ref,
  type TextareaHTMLAttributes,
} from 'react';
import { cn } from './cn';

/** What a control needs from its field: an id for the label and the ids that describe it. */
export type ControlProps = {
  id: string;
  'aria-invalid': boolean | undefined;
  'aria-describedby': string | undefined;
};

/**
 * A label, the control, a hint and an error, tied together by ids so that screen readers
 * and role-based tests find the control by its label and hear its error.
 */
export function FormField({
  label,
  hint,
  error,
  optional,
  className,
  children,
}: {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  className?: string;
  children: (control: ControlProps) => ReactNode;
}) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <label htmlFor={id} className="text-[15px] font-semibold text-ink">
        {label}
        {optional && <span className="ml-1.5 font-normal text-muted">(optional)</span>}
      </label>
      {children({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': describedBy })}
      {hint && (
        <p id={hintId} className="text-sm text-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="text-sm font-semibold text-over">
          {error}
        </p>
      )}
    </div>
  );
}

const controlBase =
  'block w-full min-h-11 rounded-md border bg-white px-3 text-base text-ink shadow-inner shadow-ink/[0.03] ' +
  'placeholder:text-ink/40 disabled:bg-paper disabled:text-muted ' +
  'aria-[invalid=true]:border-over aria-[invalid=true]:ring-1 aria-[invalid=true]:ring-over/40';

export function TextInput({
  className,
  ref,
  ...rest
}: InputHTMLAttributes<HTMLInputElement> & { ref?: Ref<HTMLInputElement> }) {
  return (
    <input ref={ref} className={cn(controlBase, 'border-rule-strong py-2', className)} {...rest} />
  );
}

export function SelectInput({
  className,
  ref,
  children,
  ...rest
}: SelectHTMLAttributes<HTMLSelectElement> & { ref?: Ref<HTMLSelectElement> }) {
  return (
    <select
      ref={ref}
      className={cn(controlBase, 'border-rule-strong py-2 pr-8', className)}
      {...rest}
    >
      {children}
    </select>
  );
}

export function TextArea({
  className,
  ref,
  ...rest
}: TextareaHTMLAttributes<HTMLTextAreaElement> & { ref?: Ref<HTMLTextAreaElement> }) {
  return (
    <textarea
      ref={ref}
      className={cn(controlBase, 'border-rule-strong py-2', className)}
      {...rest}
    />
  );
}

/** A titled group of fields inside a long form. */
export function FieldGroup({
  legend,
  description,
  children,
}: {
  legend: string;
  description?: ReactNode;
  children: ReactNode;
}) {
  return (
    <fieldset className="rounded-lg border border-rule bg-sheet px-4 pt-2 pb-4 sm:px-5">
      <legend className="px-1 text-base font-bold text-ink">{legend}</legend>
      {description && <p className="mb-3 text-sm text-muted">{description}</p>}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

import { useId, type ReactNode } from 'react';

/**
 * One setting as a labelled switch (a checkbox drawn as one, `role="switch"`), with a line
 * saying what it does. The invisible input covers a 44 px touch target.
 */
export function SwitchRow({
  label,
  description,
  checked,
  disabled = false,
  onChange,
}: {
  label: string;
  description?: ReactNode;
  checked: boolean;
  disabled?: boolean;
  onChange: (checked: boolean) => void;
}) {
  const id = useId();
  return (
    <div className="flex items-center justify-between gap-4 py-3 first:pt-0 last:pb-0">
      <div className="min-w-0">
        <label htmlFor={id} className="cursor-pointer font-semibold text-ink">
          {label}
        </label>
        {description && (
          <p id={`${id}-description`} className="text-sm text-muted">
            {description}
          </p>
        )}
      </div>
      <span className="relative flex min-h-11 w-14 shrink-0 items-center justify-end">
        <input
          id={id}
          type="checkbox"
          role="switch"
          checked={checked}
          disabled={disabled}
          onChange={(event) => onChange(event.target.checked)}
          aria-describedby={description ? `${id}-description` : undefined}
          className="peer absolute inset-0 m-0 size-full cursor-pointer opacity-0 disabled:cursor-not-allowed"
        />
        <span
          aria-hidden
          className="h-7 w-12 rounded-full bg-rule-strong transition-colors peer-checked:bg-accent-600 peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500 peer-disabled:opacity-60"
        />
        <span
          aria-hidden
          className="pointer-events-none absolute top-1/2 right-[1.375rem] size-6 -translate-y-1/2 rounded-full bg-white shadow transition-transform peer-checked:translate-x-5"
        />
      </span>
    </div>
  );
}

import { useEffect, useRef, useState, type FocusEventHandler, type Ref } from 'react';
import { centsToInput, parseMoneyToCents } from '@shared/format';
import { TextInput, type ControlProps } from './form-field';

type MoneyInputProps = ControlProps & {
  /** Integer minor units; undefined when empty; NaN while the text is not an amount. */
  value: number | null | undefined;
  onChange: (cents: number | undefined) => void;
  onBlur?: FocusEventHandler<HTMLInputElement>;
  currency: string;
  name?: string;
  ref?: Ref<HTMLInputElement>;
  disabled?: boolean;
};

function sameAmount(a: number | null | undefined, b: number | null | undefined): boolean {
  if (a == null || b == null) return a == null && b == null;
  if (Number.isNaN(a) || Number.isNaN(b)) return Number.isNaN(a) && Number.isNaN(b);
  return a === b;
}

/**
 * An amount typed in currency units ("18500.00") held by the form as integer cents.
 * The text is parsed digit by digit (see parseMoneyToCents), never through a float.
 */
export function MoneyInput({
  value,
  onChange,
  onBlur,
  currency,
  name,
  ref,
  disabled,
  ...control
}: MoneyInputProps) {
  const [text, setText] = useState(() =>
    value == null || Number.isNaN(value) ? '' : centsToInput(value, currency),
  );
  const emitted = useRef<number | null | undefined>(value);

  // A reset from outside (e.g. the form's defaults arriving) replaces the text.
  useEffect(() => {
    if (!sameAmount(value, emitted.current)) {
      emitted.current = value;
      setText(value == null || Number.isNaN(value) ? '' : centsToInput(value, currency));
    }
  }, [value, currency]);

  return (
    <div className="relative">
      <span
        aria-hidden
        className="pointer-events-none absolute inset-y-0 left-3 flex items-center text-sm font-semibold text-muted"
      >
        {currency}
      </span>
      <TextInput
        {...control}
        ref={ref}
        name={name}
        disabled={disabled}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        placeholder="0.00"
        className="pl-14 tabular-nums"
        value={text}
        onChange={(event) => {
          const next = event.target.value;
          setText(next);
          const cents = parseMoneyToCents(next, currency);
          const out = cents === null ? undefined : cents;
          emitted.current = out;
          onChange(out);
        }}
        onBlur={onBlur}
      />
    </div>
  );
}

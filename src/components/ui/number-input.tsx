import {
  useEffect,
  useRef,
  type ChangeEvent,
  type InputHTMLAttributes,
  type ReactNode,
  type Ref,
  type SelectHTMLAttributes,
} from 'react';
import { numberToInput, parseNumber } from '@shared/numbers';
import { cn } from './cn';
import { SelectInput, TextInput } from './form-field';

/**
 * The one number box. It keeps the text as typed ("1,250.5", "12,5") and reads it with
 * `parseNumber` from shared/numbers: in a react-hook-form form register it with
 * `register(name, { setValueAs: parseNumber })`; a controlled box reports the number through
 * `onNumber`. `unit` shows the unit inside the box on the right (hidden from screen readers:
 * say it in the label or hint as well). `integer` asks phones for the digits keypad.
 */
export type NumberInputProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'type'> & {
  ref?: Ref<HTMLInputElement>;
  unit?: ReactNode;
  integer?: boolean;
  /** Called on each change with the number read (null empty, NaN unreadable). */
  onNumber?: (value: number | null) => void;
};

export function NumberInput({
  unit,
  integer = false,
  onNumber,
  onChange,
  className,
  ...rest
}: NumberInputProps) {
  const input = (
    <TextInput
      type="text"
      inputMode={integer ? 'numeric' : 'decimal'}
      autoComplete="off"
      {...rest}
      className={cn('tabular-nums', unit != null && 'pr-16', className)}
      onChange={(event) => {
        onChange?.(event);
        onNumber?.(parseNumber(event.target.value));
      }}
    />
  );
  if (unit == null) return input;
  return (
    <div className="relative">
      {input}
      <span
        aria-hidden
        className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm font-semibold text-muted"
      >
        {unit}
      </span>
    </div>
  );
}

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { ref?: Ref<HTMLSelectElement> };

/**
 * A number with its unit switch. Switching the unit converts the figure in the box with
 * `convert` (from shared/units) rather than reinterpreting it; without `convert` the switch
 * only changes the unit. Works registered (`unitSelect={register('bsfcUnit')}` beside
 * `{...register('bsfc', { setValueAs: parseNumber })}`) and controlled (`value`/`onChange`
 * on both). The switch is named by `unitLabel` for screen readers.
 */
export function UnitInput<U extends string>({
  units,
  unitLabels,
  unitLabel,
  unitSelect,
  convert,
  unitClassName,
  ref,
  ...number
}: Omit<NumberInputProps, 'unit'> & {
  units: readonly U[];
  unitLabels: Record<U, string>;
  unitLabel: string;
  unitSelect: SelectProps;
  convert?: (value: number, from: U, to: U) => number;
  unitClassName?: string;
}) {
  const box = useRef<HTMLInputElement | null>(null);
  const select = useRef<HTMLSelectElement | null>(null);
  const lastUnit = useRef<U | null>(null);
  useEffect(() => {
    if (select.current) lastUnit.current = select.current.value as U;
  });

  const setRef =
    <T,>(own: { current: T | null }, theirs: Ref<T> | undefined) =>
    (el: T | null) => {
      own.current = el;
      if (typeof theirs === 'function') theirs(el);
      else if (theirs) theirs.current = el;
    };

  const switchUnit = (event: ChangeEvent<HTMLSelectElement>) => {
    const to = event.target.value as U;
    const from = lastUnit.current;
    lastUnit.current = to;
    unitSelect.onChange?.(event);
    const el = box.current;
    if (!convert || !el || from === null || from === to) return;
    const value = parseNumber(el.value);
    if (value === null || !Number.isFinite(value)) return;
    const text = numberToInput(convert(value, from, to));
    if (number.value !== undefined) {
      // Controlled: hand the converted text to the owner as if typed.
      number.onChange?.({ target: { value: text } } as ChangeEvent<HTMLInputElement>);
    } else {
      el.value = text;
      number.onChange?.({
        target: el,
        currentTarget: el,
        type: 'change',
      } as unknown as ChangeEvent<HTMLInputElement>);
    }
    number.onNumber?.(parseNumber(text));
  };

  return (
    <div className="flex gap-2">
      <div className="min-w-0 flex-1">
        <NumberInput {...number} ref={setRef(box, ref)} />
      </div>
      <div className={cn('w-36 shrink-0', unitClassName)}>
        <SelectInput
          aria-label={unitLabel}
          {...unitSelect}
          ref={setRef(select, unitSelect.ref)}
          onFocus={(e) => {
            lastUnit.current = e.target.value as U;
            unitSelect.onFocus?.(e);
          }}
          onChange={switchUnit}
        >
          {units.map((u) => (
            <option key={u} value={u}>
              {unitLabels[u]}
            </option>
          ))}
        </SelectInput>
      </div>
    </div>
  );
}

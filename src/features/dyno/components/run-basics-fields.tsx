import type { ChangeEvent, FocusEvent, Ref } from 'react';
import { runStatuses, runStatusLabels, type RunStatus } from '@shared/schemas/dyno';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';

type RunBasic = 'status' | 'abortReason' | 'gear' | 'tuneRevision';

/** What ties a box to its form: react-hook-form's `register(name)`, or a value and onChange. */
export type RunFieldBinding = {
  name?: string;
  value?: string;
  ref?: Ref<HTMLInputElement & HTMLSelectElement>;
  onChange?: (event: ChangeEvent<HTMLInputElement & HTMLSelectElement>) => unknown;
  onBlur?: (event: FocusEvent<HTMLInputElement & HTMLSelectElement>) => unknown;
};

/**
 * The run's status (with why it was stopped when aborted), gear and tune revision: the same
 * boxes on the run form and beside a curve import.
 */
export function RunBasicsFields({
  status,
  bind,
  errors,
}: {
  status: RunStatus;
  bind: (name: RunBasic) => RunFieldBinding;
  errors: Partial<Record<RunBasic, string>>;
}) {
  return (
    <>
      <FormField label="Status" error={errors.status}>
        {(c) => (
          <SelectInput {...c} {...bind('status')}>
            {runStatuses.map((s) => (
              <option key={s} value={s}>
                {runStatusLabels[s]}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      {status === 'aborted' && (
        <FormField label="Why it was stopped" error={errors.abortReason}>
          {(c) => <TextInput {...c} {...bind('abortReason')} />}
        </FormField>
      )}
      <FormField label="Gear" optional error={errors.gear}>
        {(c) => <TextInput {...c} {...bind('gear')} />}
      </FormField>
      <FormField label="Tune revision" optional error={errors.tuneRevision}>
        {(c) => <TextInput {...c} {...bind('tuneRevision')} />}
      </FormField>
    </>
  );
}

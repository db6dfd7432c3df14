import { useId, useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import { deviceToday } from '@shared/dates';
import { formatIsoDate } from '@shared/format';
import type { Wrench } from '@shared/schemas/wrenches';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';
import { useCreateWrench } from '../api/create-wrench';
import { useDeleteWrench } from '../api/delete-wrench';
import { useWrenches } from '../api/get-wrenches';
import { useUpdateWrench } from '../api/update-wrench';

/** One wrench: its name and the day it was last calibrated, which I update after each calibration. */
function WrenchRow({ wrench }: { wrench: Wrench }) {
  const id = useId();
  const update = useUpdateWrench();
  const remove = useDeleteWrench();
  const [date, setDate] = useState(wrench.calibratedOn ?? '');
  const changed = date !== (wrench.calibratedOn ?? '');
  const error = isApiError(update.error)
    ? (update.error.fields?.calibratedOn ?? update.error.message)
    : (update.error?.message ?? remove.error?.message);
  return (
    <li className="flex flex-col gap-2 py-3 first:pt-0 last:pb-0">
      <div className="flex items-start justify-between gap-2">
        <p className="min-w-0 font-semibold break-words text-ink">{wrench.name}</p>
        <button
          type="button"
          onClick={() => remove.mutate(wrench.id)}
          aria-label={`Delete the wrench “${wrench.name}”`}
          className="-mt-2 -mr-2 inline-flex size-11 shrink-0 items-center justify-center rounded-md text-muted hover:bg-over-soft hover:text-over"
        >
          <Trash2 aria-hidden className="size-5" />
        </button>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <label htmlFor={id} className="text-[15px] text-ink-2">
          Last calibrated<span className="sr-only"> ({wrench.name})</span>
        </label>
        <TextInput
          id={id}
          type="date"
          value={date}
          max={deviceToday()}
          onChange={(e) => setDate(e.target.value)}
          className="w-auto!"
        />
        {changed && (
          <Button
            size="sm"
            pending={update.isPending}
            onClick={() =>
              update.mutate({ wrenchId: wrench.id, input: { calibratedOn: date || null } })
            }
          >
            Save date
          </Button>
        )}
        {!changed && wrench.calibratedOn && (
          <span className="text-sm text-muted">{formatIsoDate(wrench.calibratedOn)}</span>
        )}
      </div>
      {error && (
        <p role="alert" className="text-sm font-semibold text-over">
          {error}
        </p>
      )}
    </li>
  );
}

function AddWrenchForm() {
  const create = useCreateWrench();
  const [name, setName] = useState('');
  const [calibratedOn, setCalibratedOn] = useState('');
  const fields = isApiError(create.error) ? (create.error.fields ?? {}) : {};
  return (
    <form
      aria-label="Add a wrench"
      noValidate
      className="flex flex-col gap-3 border-t border-rule pt-4"
      onSubmit={(e) => {
        e.preventDefault();
        create.mutate(
          { name, calibratedOn: calibratedOn || null },
          {
            onSuccess: () => {
              setName('');
              setCalibratedOn('');
            },
          },
        );
      }}
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[minmax(0,1fr)_12rem]">
        <FormField label="Wrench name or number" error={fields.name}>
          {(c) => (
            <TextInput
              {...c}
              value={name}
              onChange={(e) => setName(e.target.value)}
              autoComplete="off"
              placeholder="e.g. 3/8 in. click, 10–80 lbf·ft"
            />
          )}
        </FormField>
        <FormField label="Last calibrated" optional error={fields.calibratedOn}>
          {(c) => (
            <TextInput
              {...c}
              type="date"
              value={calibratedOn}
              max={deviceToday()}
              onChange={(e) => setCalibratedOn(e.target.value)}
            />
          )}
        </FormField>
      </div>
      {create.isError && !fields.name && !fields.calibratedOn && (
        <p role="alert" className="text-sm font-semibold text-over">
          {create.error.message}
        </p>
      )}
      <div>
        <Button
          type="submit"
          variant="secondary"
          pending={create.isPending}
          icon={<Plus aria-hidden className="size-4" />}
        >
          Add the wrench
        </Button>
      </div>
    </form>
  );
}

/**
 * My torque wrenches and when each was last calibrated. The step page offers them when I
 * record a reading; a reading taken with one past the build's interval is flagged.
 */
export function WrenchList() {
  const wrenches = useWrenches();
  let body;
  if (wrenches.isPending) body = <PageSpinner label="Loading your wrenches…" />;
  else if (wrenches.isError)
    body = (
      <ErrorState
        title="Could not load your wrenches"
        error={wrenches.error}
        onRetry={() => void wrenches.refetch()}
      />
    );
  else if (wrenches.data.length === 0)
    body = (
      <p className="text-muted">
        No wrenches yet. Add the ones you torque with, and when each was last calibrated.
      </p>
    );
  else
    body = (
      <ul aria-label="Your wrenches" className="divide-y divide-rule">
        {wrenches.data.map((w) => (
          <WrenchRow key={`${w.id}:${w.calibratedOn ?? ''}`} wrench={w} />
        ))}
      </ul>
    );
  return (
    <div className="flex flex-col gap-4">
      {body}
      <AddWrenchForm />
    </div>
  );
}

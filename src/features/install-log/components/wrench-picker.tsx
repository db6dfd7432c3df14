import { useId, useState } from 'react';
import { Plus, TriangleAlert } from 'lucide-react';
import { deviceToday } from '@shared/dates';
import { formatIsoDate } from '@shared/format';
import { calibrationOn } from '@shared/install-log/wrenches';
import type { Wrench } from '@shared/schemas/wrenches';
import { Button } from '@/components/ui/button';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { useCreateWrench } from '@/features/wrenches/api/create-wrench';
import { useWrenches } from '@/features/wrenches/api/get-wrenches';

/** "Calibrated 14 Mar 2025, due 14 Mar 2026" for the chosen wrench, under the build's interval. */
function CalibrationLine({ wrench, months }: { wrench: Wrench; months: number }) {
  if (!wrench.calibratedOn) {
    return <p className="text-sm text-muted">No calibration date recorded for this wrench.</p>;
  }
  const c = calibrationOn(wrench.calibratedOn, months, deviceToday());
  return c.overdue ? (
    <p className="flex items-start gap-1.5 text-[15px] font-semibold text-[#6b4408]">
      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-tight" />
      Calibration was due {formatIsoDate(c.dueOn!)} ({months} months on this build). Readings are
      kept, marked as taken with it.
    </p>
  ) : (
    <p className="text-sm text-muted">
      Calibrated {formatIsoDate(c.calibratedOn!)}, due {formatIsoDate(c.dueOn!)}.
    </p>
  );
}

function AddWrench({ onAdded, onCancel }: { onAdded: (w: Wrench) => void; onCancel: () => void }) {
  const create = useCreateWrench();
  const [name, setName] = useState('');
  const [calibratedOn, setCalibratedOn] = useState('');
  const fields = isApiError(create.error) ? (create.error.fields ?? {}) : {};
  const add = async () => {
    const wrench = await create
      .mutateAsync({ name, calibratedOn: calibratedOn || null })
      .catch(() => null);
    if (wrench) onAdded(wrench);
  };
  return (
    <div className="mt-2 flex flex-col gap-3 rounded-md border border-rule-strong bg-paper p-3">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[minmax(0,1fr)_12rem]">
        <FormField
          label="Wrench name or number"
          error={fields.name}
          hint="What tells it apart: size and range, or its serial number"
        >
          {(c) => (
            <TextInput
              {...c}
              value={name}
              onChange={(e) => setName(e.target.value)}
              autoComplete="off"
              autoFocus
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
        <p role="alert" className="text-[15px] font-semibold text-over">
          {create.error.message}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button size="sm" className="min-h-12!" pending={create.isPending} onClick={add}>
          Add the wrench
        </Button>
        <Button variant="secondary" size="sm" className="min-h-12!" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}

/**
 * Which of my wrenches I am torquing with, offered from my list (kept on my account page),
 * with its calibration against this build's interval; a new one can be added here.
 */
export function WrenchPicker({
  value,
  onChange,
  calibrationMonths,
}: {
  value: string;
  onChange: (wrenchId: string) => void;
  calibrationMonths: number;
}) {
  const id = useId();
  const wrenches = useWrenches();
  const [adding, setAdding] = useState(false);
  const list = wrenches.data ?? [];
  const chosen = list.find((w) => w.id === value);

  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-[15px] font-semibold text-ink">
        Wrench used
      </label>
      <div className="flex flex-wrap items-start gap-2">
        <SelectInput
          id={id}
          value={chosen ? chosen.id : ''}
          onChange={(e) => onChange(e.target.value)}
          disabled={wrenches.isPending}
          className="min-h-12! min-w-0 flex-1 sm:max-w-md"
        >
          <option value="">
            {wrenches.isPending
              ? 'Loading your wrenches…'
              : list.length
                ? 'Not recorded'
                : 'No wrenches yet — add yours'}
          </option>
          {list.map((w) => (
            <option key={w.id} value={w.id}>
              {w.name}
            </option>
          ))}
        </SelectInput>
        {!adding && (
          <Button
            variant="secondary"
            size="sm"
            className="min-h-12!"
            icon={<Plus aria-hidden className="size-4" />}
            onClick={() => setAdding(true)}
          >
            Add a wrench
          </Button>
        )}
      </div>
      {wrenches.isError && (
        <p role="alert" className="text-sm font-semibold text-over">
          Could not load your wrenches: {wrenches.error.message}
        </p>
      )}
      {chosen && <CalibrationLine wrench={chosen} months={calibrationMonths} />}
      {adding && (
        <AddWrench
          onCancel={() => setAdding(false)}
          onAdded={(w) => {
            setAdding(false);
            onChange(w.id);
          }}
        />
      )}
    </div>
  );
}

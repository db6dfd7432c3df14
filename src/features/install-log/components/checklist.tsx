import { useState } from 'react';
import { Check, Plus, Trash2 } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { createChecklistItemInputSchema, type ChecklistItem } from '@shared/schemas/install-log';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { TextInput } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/spinner';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateChecklistItem } from '../api/create-checklist-item';
import { useDeleteChecklistItem } from '../api/delete-checklist-item';
import { useUpdateChecklistItem } from '../api/update-checklist-item';
import { formatWhen } from '@/lib/dates';
import { useOfflineQueue } from '@/lib/offline-queue';

type Input = z.input<typeof createChecklistItemInputSchema>;
type Values = z.output<typeof createChecklistItemInputSchema>;

function ChecklistRow({
  buildId,
  item,
  canTick,
  onDelete,
}: {
  buildId: string;
  item: ChecklistItem;
  canTick: boolean;
  onDelete?: () => void;
}) {
  const update = useUpdateChecklistItem();
  // While the tick travels, show where it is going. Local state, set in the same event as the
  // click, so the controlled box never flicks back before the request starts.
  const [going, setGoing] = useState<boolean | null>(null);
  const done = going ?? item.done;
  return (
    <li id={`check-${item.id}`} className="flex scroll-mt-4 items-stretch">
      <label
        className={cn(
          'flex min-h-16 flex-1 items-start gap-3 px-4 py-3 sm:px-5',
          canTick ? 'cursor-pointer hover:bg-ink/[0.03]' : 'cursor-default',
        )}
      >
        <span className="relative mt-0.5 flex size-8 shrink-0 items-center justify-center">
          <input
            type="checkbox"
            checked={done}
            disabled={!canTick || going !== null}
            onChange={(e) => {
              setGoing(e.target.checked);
              update.mutate(
                {
                  buildId,
                  stepId: item.stepId,
                  itemId: item.id,
                  input: { done: e.target.checked },
                  label: item.label,
                },
                { onSettled: () => setGoing(null) },
              );
            }}
            className="peer absolute inset-0 size-8 cursor-pointer appearance-none rounded-md border-2 border-ink-3 bg-white checked:border-ok checked:bg-ok disabled:cursor-default disabled:opacity-80"
          />
          <Check
            aria-hidden
            strokeWidth={3.5}
            className="pointer-events-none relative size-5 text-white opacity-0 peer-checked:opacity-100"
          />
        </span>
        <span className="min-w-0 flex-1">
          <span className={cn('block text-[17px] leading-snug', done && 'text-ink-2')}>
            {item.label}
          </span>
          {item.done && item.doneAt && going === null && (
            <span className="block text-sm text-muted">
              Ticked by {item.doneBy?.name ?? 'someone'}, {formatWhen(item.doneAt)}
            </span>
          )}
          {going !== null && (
            <span className="flex items-center gap-1.5 text-sm text-muted">
              <Spinner className="size-4" /> Saving…
            </span>
          )}
          {update.isError && (
            <span role="alert" className="block text-sm font-semibold text-over">
              {update.error.message}
            </span>
          )}
        </span>
      </label>
      {onDelete && (
        <button
          type="button"
          onClick={onDelete}
          aria-label={`Delete the check “${item.label}”`}
          className="inline-flex w-12 shrink-0 items-center justify-center text-muted hover:bg-over-soft hover:text-over"
        >
          <Trash2 aria-hidden className="size-5" />
        </button>
      )}
    </li>
  );
}

function AddCheckForm({ buildId, stepId }: { buildId: string; stepId: string }) {
  const create = useCreateChecklistItem();
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(createChecklistItemInputSchema),
    defaultValues: { label: '' },
  });
  const submit = handleSubmit(async (input) => {
    try {
      await create.mutateAsync({ buildId, stepId, input });
      reset({ label: '' });
    } catch (error) {
      applyServerErrors(error, setError, ['label']);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-2 px-4 py-3 sm:px-5">
      <label htmlFor={`new-check-${stepId}`} className="text-[15px] font-semibold">
        Add a check
      </label>
      <div className="flex gap-2">
        <TextInput
          id={`new-check-${stepId}`}
          {...register('label')}
          autoComplete="off"
          placeholder="e.g. New copper washer on each injector"
          aria-invalid={errors.label ? true : undefined}
          className="min-h-12!"
        />
        <Button
          type="submit"
          variant="secondary"
          className="min-h-12! shrink-0"
          pending={isSubmitting}
          icon={<Plus aria-hidden className="size-5" />}
        >
          Add
        </Button>
      </div>
      {errors.label?.message && (
        <p className="text-sm font-semibold text-over">{errors.label.message}</p>
      )}
      <FormError message={errors.root?.server?.message} />
    </form>
  );
}

/** The step's checks, each a big tick box with who ticked it and when. */
export function Checklist({
  buildId,
  stepId,
  items,
  canTick,
  canAdd,
  canDelete,
}: {
  buildId: string;
  stepId: string;
  items: ChecklistItem[];
  canTick: boolean;
  canAdd: boolean;
  canDelete: boolean;
}) {
  // A tick kept on the phone shows as made, after a reload too (the saved step may predate it).
  const waiting = useOfflineQueue().items.filter(
    (w) => w.kind === 'tick' && w.stepId === stepId && !w.problem,
  );
  const shown = items.map((item) => {
    const last = waiting.findLast((w) => w.path.endsWith(`/checklist/${item.id}`));
    const done = (last?.body as { done?: boolean } | undefined)?.done;
    return done === undefined ? item : { ...item, done, doneBy: null, doneAt: null };
  });
  const remove = useDeleteChecklistItem();
  const [deleting, setDeleting] = useState<ChecklistItem | null>(null);
  const done = shown.filter((i) => i.done).length;
  return (
    <section aria-labelledby="checklist-title" className="rounded-lg border border-rule bg-sheet">
      <div className="flex items-baseline justify-between gap-2 border-b border-rule px-4 py-2.5 sm:px-5">
        <h2 id="checklist-title" className="text-lg font-bold">
          Checklist
        </h2>
        {shown.length > 0 && (
          <span className="font-semibold text-ink-2 tabular-nums">
            {done} of {shown.length} ticked
          </span>
        )}
      </div>
      {shown.length > 0 ? (
        <ul className="divide-y divide-rule">
          {shown.map((item) => (
            <ChecklistRow
              key={item.id}
              buildId={buildId}
              item={item}
              canTick={canTick}
              onDelete={
                canDelete
                  ? () => {
                      remove.reset();
                      setDeleting(item);
                    }
                  : undefined
              }
            />
          ))}
        </ul>
      ) : (
        <p className="px-4 py-3 text-muted sm:px-5">No checks on this step.</p>
      )}
      {canAdd && (
        <div className="border-t border-rule">
          <AddCheckForm buildId={buildId} stepId={stepId} />
        </div>
      )}
      <ConfirmDialog
        open={deleting !== null}
        title="Delete this check?"
        confirmLabel="Delete the check"
        pending={remove.isPending}
        onClose={() => setDeleting(null)}
        onConfirm={async () => {
          if (!deleting) return;
          await remove
            .mutateAsync({ buildId, stepId, itemId: deleting.id })
            .then(() => setDeleting(null))
            .catch(() => undefined);
        }}
      >
        “{deleting?.label}” goes, with its tick.
        {remove.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {remove.error.message}
          </p>
        )}
      </ConfirmDialog>
    </section>
  );
}

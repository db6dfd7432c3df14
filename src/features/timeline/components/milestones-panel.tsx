import { useState } from 'react';
import { Milestone as MilestoneIcon, Pencil, Trash2 } from 'lucide-react';
import { longDate } from '@shared/dates';
import type { Milestone } from '@shared/schemas/timeline';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { Modal } from '@/components/ui/modal';
import { isApiError } from '@/lib/api-client';
import { useCreateMilestone } from '../api/create-milestone';
import { useDeleteMilestone } from '../api/delete-milestone';
import { useUpdateMilestone } from '../api/update-milestone';
import { milestoneElementId } from './links';
import { MilestoneForm } from './milestone-form';

function MilestoneRow({
  buildId,
  milestone: m,
  today,
  canEdit,
  onEdit,
  onDelete,
}: {
  buildId: string;
  milestone: Milestone;
  today: string;
  canEdit: boolean;
  onEdit: () => void;
  onDelete: () => void;
}) {
  const update = useUpdateMilestone();
  // The tick shows at once: the mutation writes it into the cached timeline first.
  const done = m.done;
  const late = !done && m.dueOn < today;
  const checkId = `${milestoneElementId(m.id)}-done`;
  return (
    <li id={milestoneElementId(m.id)} className="flex scroll-mt-4 items-center gap-2 py-2">
      {canEdit ? (
        <input
          id={checkId}
          type="checkbox"
          checked={done}
          disabled={update.isPending}
          onChange={(e) =>
            update.mutate({ buildId, milestoneId: m.id, input: { done: e.target.checked } })
          }
          className="size-6 shrink-0 cursor-pointer accent-accent-600"
          aria-describedby={`${checkId}-date`}
        />
      ) : null}
      <div className="min-w-0 flex-1">
        <label
          htmlFor={canEdit ? checkId : undefined}
          className={`block font-semibold break-words ${done ? 'text-muted line-through' : 'text-ink'}`}
        >
          {m.title}
        </label>
        <p id={`${checkId}-date`} className="text-sm text-muted">
          <time dateTime={m.dueOn}>{longDate(m.dueOn)}</time>
        </p>
        {update.isError && <FormError message="Could not save. Try again." />}
      </div>
      {late && <Badge tone="over">Past due</Badge>}
      {m.done && !canEdit && <Badge tone="ok">Done</Badge>}
      {canEdit && (
        <div className="flex shrink-0">
          <Button
            variant="ghost"
            size="sm"
            onClick={onEdit}
            aria-label={`Change “${m.title}”`}
            icon={<Pencil aria-hidden className="size-4" />}
          />
          <Button
            variant="ghost"
            size="sm"
            onClick={onDelete}
            aria-label={`Remove “${m.title}”`}
            icon={<Trash2 aria-hidden className="size-4" />}
          />
        </div>
      )}
    </li>
  );
}

/** The owner's milestones: added, ticked off, changed and removed here; read by crew and viewers. */
export function MilestonesPanel({
  buildId,
  milestones,
  today,
  canEdit,
}: {
  buildId: string;
  milestones: Milestone[];
  today: string;
  canEdit: boolean;
}) {
  const create = useCreateMilestone();
  const update = useUpdateMilestone();
  const remove = useDeleteMilestone();
  const [editing, setEditing] = useState<Milestone | null>(null);
  const [deleting, setDeleting] = useState<Milestone | null>(null);

  return (
    <Section
      id="milestones"
      title="Milestones"
      icon={<MilestoneIcon aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-4">
        {milestones.length ? (
          <ul className="flex flex-col divide-y divide-rule">
            {milestones.map((m) => (
              <MilestoneRow
                key={m.id}
                buildId={buildId}
                milestone={m}
                today={today}
                canEdit={canEdit}
                onEdit={() => setEditing(m)}
                onDelete={() => {
                  remove.reset();
                  setDeleting(m);
                }}
              />
            ))}
          </ul>
        ) : (
          <p className="text-muted">
            No milestones yet.
            {canEdit
              ? ' Add the points that matter on the way: engine back together, first start, tune day.'
              : ' The owner adds them.'}
          </p>
        )}
        {canEdit && (
          <MilestoneForm
            submitLabel="Add milestone"
            onSubmit={(input) => create.mutateAsync({ buildId, input })}
          />
        )}
      </div>
      <Modal
        open={editing !== null}
        title="Change the milestone"
        onClose={() => setEditing(null)}
        busy={update.isPending}
      >
        {editing && (
          <MilestoneForm
            milestone={editing}
            submitLabel="Save"
            onCancel={() => setEditing(null)}
            onSubmit={async (input) => {
              await update.mutateAsync({ buildId, milestoneId: editing.id, input });
              setEditing(null);
            }}
          />
        )}
      </Modal>
      <ConfirmDialog
        open={deleting !== null}
        title="Remove this milestone?"
        confirmLabel="Remove"
        pending={remove.isPending}
        onClose={() => setDeleting(null)}
        onConfirm={() =>
          deleting &&
          remove.mutate(
            { buildId, milestoneId: deleting.id },
            { onSuccess: () => setDeleting(null) },
          )
        }
      >
        <p>“{deleting?.title}” leaves the timeline and everyone’s calendar.</p>
        {remove.isError && (
          <FormError
            message={isApiError(remove.error) ? remove.error.message : 'Could not remove it.'}
          />
        )}
      </ConfirmDialog>
    </Section>
  );
}

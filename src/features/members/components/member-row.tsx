import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { roleLabels, roles, type Role } from '@shared/permissions';
import type { Member } from '@shared/schemas/builds';
import { formatTimestampDate } from '@shared/format';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectInput } from '@/components/ui/form-field';
import { Spinner } from '@/components/ui/spinner';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { RoleBadge } from '@/components/ui/role-badge';
import { useRemoveMember } from '../api/remove-member';
import { useUpdateMember } from '../api/update-member';

function errorText(error: unknown, fallback: string): string {
  return isApiError(error) ? error.message : fallback;
}

/**
 * One person on the build. Owners get a role picker and a remove button; the API refuses
 * (409 last_owner) any change that would leave the build without an owner, and that
 * message is shown on the row.
 */
export function MemberRow({
  buildId,
  member,
  isMe,
  canManage,
}: {
  buildId: string;
  member: Member;
  isMe: boolean;
  canManage: boolean;
}) {
  const navigate = useNavigate();
  const updateMember = useUpdateMember();
  const removeMember = useRemoveMember({
    onLeft: () => navigate(paths.builds.list.getHref(), { replace: true }),
  });
  const [draftRole, setDraftRole] = useState<Role | null>(null);
  const [confirm, setConfirm] = useState<null | 'remove' | 'demote-self'>(null);

  const name = member.displayName;

  function changeRole(role: Role) {
    if (role === member.role) return;
    removeMember.reset();
    setDraftRole(role);
    updateMember.mutate(
      { buildId, userId: member.userId, input: { role } },
      { onSettled: () => setDraftRole(null) },
    );
  }

  const shownRole = draftRole ?? member.role;

  return (
    <li className="flex flex-col gap-2 py-3 first:pt-0 last:pb-0">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
        <div className="min-w-0 flex-1 basis-48">
          <p className="font-semibold break-words text-ink">
            {name}
            {isMe && <span className="ml-1.5 font-normal text-muted">(you)</span>}
          </p>
          {member.email && <p className="text-sm break-all text-muted">{member.email}</p>}
          <p className="text-sm text-muted">Joined {formatTimestampDate(member.joinedAt)}</p>
        </div>
        {canManage ? (
          <div className="flex w-full items-center gap-2 sm:w-auto">
            {/* Not labelled "Role …": the add form's select owns the label "Role". */}
            <SelectInput
              aria-label={`Access for ${name}`}
              value={shownRole}
              disabled={updateMember.isPending}
              className="min-w-0 flex-1 sm:w-36 sm:flex-none"
              onChange={(event) => {
                const role = event.target.value as Role;
                if (isMe && member.role === 'owner' && role !== 'owner') {
                  setDraftRole(role);
                  setConfirm('demote-self');
                  return;
                }
                changeRole(role);
              }}
            >
              {roles.map((value) => (
                <option key={value} value={value}>
                  {roleLabels[value]}
                </option>
              ))}
            </SelectInput>
            {updateMember.isPending && <Spinner className="size-5" />}
            <Button
              variant="ghost"
              size="sm"
              className="min-w-20 text-over"
              aria-label={isMe ? 'Leave this build' : `Remove ${name}`}
              onClick={() => {
                updateMember.reset();
                removeMember.reset();
                setConfirm('remove');
              }}
            >
              {isMe ? 'Leave' : 'Remove'}
            </Button>
          </div>
        ) : (
          <RoleBadge role={member.role} />
        )}
      </div>

      {updateMember.isError && (
        <Alert tone="error">
          {errorText(updateMember.error, 'Could not change the role. Try again.')}
        </Alert>
      )}
      {removeMember.isError && confirm === null && (
        <Alert tone="error">
          {errorText(removeMember.error, 'Could not remove them. Try again.')}
        </Alert>
      )}

      <ConfirmDialog
        open={confirm === 'remove'}
        title={isMe ? 'Leave this build?' : `Remove ${name}?`}
        confirmLabel={isMe ? 'Yes, leave' : 'Yes, remove'}
        pending={removeMember.isPending}
        onClose={() => setConfirm(null)}
        onConfirm={() =>
          removeMember.mutate(
            { buildId, userId: member.userId, leaving: isMe },
            { onSettled: () => setConfirm(null) },
          )
        }
      >
        {isMe
          ? 'You will lose access to this build. Another owner can add you back.'
          : `${name} will no longer see this build. You can add them again later.`}
      </ConfirmDialog>

      <ConfirmDialog
        open={confirm === 'demote-self'}
        title="Give up owner access?"
        confirmLabel="Yes, change my role"
        tone="primary"
        onClose={() => {
          setConfirm(null);
          setDraftRole(null);
        }}
        onConfirm={() => {
          const role = draftRole;
          setConfirm(null);
          if (role) changeRole(role);
        }}
      >
        You will no longer be able to see money, edit the build or manage its people.
      </ConfirmDialog>
    </li>
  );
}

import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Trash2 } from 'lucide-react';
import type { Build } from '@shared/schemas/builds';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useDeleteBuild } from '../api/delete-build';

/** "Delete build" and its confirmation; owners only (the caller checks). */
export function DeleteBuild({ build }: { build: Build }) {
  const [open, setOpen] = useState(false);
  const navigate = useNavigate();
  const deleteBuild = useDeleteBuild({
    onDeleted: () => navigate(paths.builds.list.getHref(), { replace: true }),
  });

  return (
    <>
      <Button
        variant="secondary"
        icon={<Trash2 aria-hidden className="size-4 text-over" />}
        onClick={() => {
          deleteBuild.reset();
          setOpen(true);
        }}
      >
        Delete build
      </Button>
      <ConfirmDialog
        open={open}
        title={`Delete “${build.name}”?`}
        confirmLabel="Yes, delete"
        pending={deleteBuild.isPending}
        onClose={() => setOpen(false)}
        onConfirm={() => deleteBuild.mutate(build.id)}
      >
        <p>
          The build, its crew list and everything recorded under it go for good. This cannot be
          undone.
        </p>
        {deleteBuild.isError && (
          <Alert tone="error" className="mt-3">
            {isApiError(deleteBuild.error)
              ? deleteBuild.error.message
              : 'Could not delete the build. Try again.'}
          </Alert>
        )}
      </ConfirmDialog>
    </>
  );
}

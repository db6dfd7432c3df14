import { useCallback, useEffect, useMemo, useState } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { Download, FileUp, Package, Plus } from 'lucide-react';
import { buildToday } from '@shared/dates';
import { capabilities } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Part, PartStatus, UpdatePartInput } from '@shared/schemas/parts';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { useBuild } from '@/features/builds/api/get-build';
import { useMembers } from '@/features/members/api/get-members';
import { useCreatePart } from '@/features/parts/api/create-part';
import { useDeletePart } from '@/features/parts/api/delete-part';
import { getPartsCsvHref } from '@/features/parts/api/export-parts-csv';
import { useParts } from '@/features/parts/api/get-parts';
import { useUpdatePart } from '@/features/parts/api/update-part';
import { ImportPartsDialog } from '@/features/parts/components/import-parts';
import type { LedgerActions } from '@/features/parts/components/parts-columns';
import { PartsLedger } from '@/features/parts/components/parts-ledger';
import { statusChange } from '@/features/parts/lib/status';
import { stampStatusDates } from '@shared/ledger/status-dates';
import { BuildLoadError } from './build-states';
import { DeletePartDialog, PartDialog, type Editing } from './parts-dialogs';

/** "/builds/:buildId/parts" — the ledger of every part of the build. */
export function PartsRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <PartsPage build={build.data} />;
}

function PartsPage({ build }: { build: Build }) {
  const [searchParams] = useSearchParams();
  const parts = useParts(build.id);
  const createPart = useCreatePart();
  const updatePart = useUpdatePart();
  const deletePart = useDeletePart();
  const role = build.myRole;
  const {
    canEditPartFully,
    canAddParts,
    canSeeMoney,
    canUpdatePartProgress: canUpdate,
    canDeleteParts: canDelete,
    canImportParts: canImport,
  } = capabilities(role);
  const members = useMembers(build.id);

  const [editing, setEditing] = useState<Editing>(null);
  const [deleting, setDeleting] = useState<Part | null>(null);
  const [importing, setImporting] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  // "?part=<id>", a link from the estimate: the owner gets that part's form at its rating;
  // everyone else sees its row picked out in the ledger. Once per link, not on every refetch.
  const linkedPartId = searchParams.get('part');
  const [linkHandled, setLinkHandled] = useState<string | null>(null);
  const [missingPart, setMissingPart] = useState(false);
  useEffect(() => {
    if (!linkedPartId || linkHandled === linkedPartId || !parts.data) return;
    setLinkHandled(linkedPartId);
    const part = parts.data.find((p) => p.id === linkedPartId);
    setMissingPart(!part);
    if (part && canEditPartFully) setEditing({ mode: 'edit', part, focusRating: true });
  }, [linkedPartId, linkHandled, parts.data, canEditPartFully]);

  const shops = useMemo(
    () =>
      (members.data ?? [])
        .filter((m) => m.role === 'shop')
        .map((m) => ({ userId: m.userId, displayName: m.displayName })),
    [members.data],
  );

  const { mutateAsync: update } = updatePart;
  const onStatusChange = useCallback(
    async (part: Part, status: PartStatus) => {
      setNotice(null);
      await update({
        buildId: build.id,
        partId: part.id,
        input: statusChange(part, status, buildToday(build)),
      });
    },
    [update, build],
  );
  const onEdit = useCallback(
    (part: Part) => setEditing({ mode: canEditPartFully ? 'edit' : 'progress', part }),
    [canEditPartFully],
  );
  const { reset: resetDelete } = deletePart;
  const onDelete = useCallback(
    (part: Part) => {
      resetDelete();
      setDeleting(part);
    },
    [resetDelete],
  );

  const actions = useMemo<LedgerActions>(
    () => ({
      currency: build.currency,
      onStatusChange: canUpdate ? onStatusChange : undefined,
      onEdit: canUpdate ? onEdit : undefined,
      onDelete: canDelete ? onDelete : undefined,
    }),
    [build.currency, canUpdate, canDelete, onStatusChange, onEdit, onDelete],
  );

  async function save(typed: UpdatePartInput) {
    if (!editing) return;
    // The form's status change is dated like a row's: the build's today, by the shared rule.
    const input = stampStatusDates(
      editing.mode === 'create' ? null : editing.part,
      typed,
      buildToday(build),
    );
    if (editing.mode === 'create') {
      const part = await createPart.mutateAsync({
        buildId: build.id,
        input: input as Parameters<typeof createPart.mutateAsync>[0]['input'],
      });
      setNotice(`Added “${part.name}”.`);
    } else {
      const part = await updatePart.mutateAsync({
        buildId: build.id,
        partId: editing.part.id,
        input,
      });
      setNotice(`Saved “${part.name}”.`);
    }
    setEditing(null);
  }

  const addButton = canAddParts && (
    <Button
      icon={<Plus aria-hidden className="size-5" />}
      onClick={() => {
        setNotice(null);
        setEditing({ mode: 'create' });
      }}
    >
      Add part
    </Button>
  );
  const importButton = canImport && (
    <Button
      variant="secondary"
      icon={<FileUp aria-hidden className="size-4" />}
      onClick={() => {
        setNotice(null);
        setImporting(true);
      }}
    >
      Import CSV
    </Button>
  );
  const exportLink = (
    <a href={getPartsCsvHref(build.id)} download className={buttonClasses('secondary', 'md')}>
      <Download aria-hidden className="size-4" />
      Export CSV
    </a>
  );

  let body;
  if (parts.isPending) {
    body = <PageSpinner label="Loading the parts…" />;
  } else if (parts.isError) {
    body = (
      <ErrorState
        title="Could not load the parts"
        error={parts.error}
        onRetry={() => void parts.refetch()}
      />
    );
  } else if (parts.data.length === 0) {
    body = (
      <EmptyState
        icon={<Package aria-hidden className="size-6" />}
        title={role === 'shop' ? 'Nothing has been sent to you yet' : 'No parts yet'}
        actions={
          canAddParts ? (
            <>
              {addButton}
              {importButton}
            </>
          ) : undefined
        }
      >
        {canAddParts
          ? 'List every part the build needs: what it is, what it costs, where it is.'
          : role === 'shop'
            ? 'Parts the owner sends to your shop appear here.'
            : 'The owner has not listed any parts yet.'}
      </EmptyState>
    );
  } else {
    body = (
      <PartsLedger
        parts={parts.data}
        actions={actions}
        moneyFallback={canSeeMoney ? 'full' : 'none'}
        initialSearch={searchParams.get('q') ?? ''}
        focusPartId={missingPart ? null : linkedPartId}
        toolbarActions={
          <>
            {exportLink}
            {importButton}
            {addButton}
          </>
        }
      />
    );
  }

  return (
    <>
      <title>{`Parts · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Parts"
        subtitle={<span>{build.name}</span>}
        badges={
          !canEditPartFully && (
            <span className="text-base text-muted">
              {role === 'shop'
                ? 'Parts sent to your shop'
                : canUpdate
                  ? 'You can change status and dates'
                  : 'Read only'}
            </span>
          )
        }
      />

      {notice && (
        <Alert tone="ok" className="mb-4">
          {notice}
        </Alert>
      )}
      {missingPart && (
        <Alert tone="info" className="mb-4">
          The part that link points to is not in this ledger: it may have been deleted.
        </Alert>
      )}

      {body}

      <PartDialog
        editing={editing}
        build={build}
        shops={shops}
        busy={createPart.isPending || updatePart.isPending}
        onSubmit={save}
        onClose={() => setEditing(null)}
      />

      <DeletePartDialog
        part={deleting}
        buildId={build.id}
        deletePart={deletePart}
        onClose={() => setDeleting(null)}
        onDeleted={(name) => {
          setNotice(`Deleted “${name}”.`);
          setDeleting(null);
        }}
      />

      {canImport && (
        <ImportPartsDialog
          open={importing}
          buildId={build.id}
          currency={build.currency}
          onClose={() => setImporting(false)}
          onImported={(count) => {
            setImporting(false);
            setNotice(`Imported ${count} ${count === 1 ? 'part' : 'parts'}.`);
          }}
        />
      )}
    </>
  );
}

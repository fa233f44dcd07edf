import { useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { CopyButton } from '@/components/ui/copy-button';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { problemMessage } from '@/lib/form-errors';
import { useCan } from '@/lib/session';
import {
  useDeleteGelKit,
  useDeleteGelPiece,
  useDeleteLight,
  useDeleteModifier,
  useGelKits,
  useLights,
  useModifiers,
  type GelKit,
  type GelPiece,
  type Light,
  type Modifier,
} from '../api/gear';
import { GelPieceDialog, type GelPieceTarget } from './gel-piece-dialog';
import { LightDialog } from './light-dialog';
import { ModifierDialog } from './modifier-dialog';
import { NewGelKitForm } from './new-gel-kit-form';
import { LoadError } from '@/components/ui/load-error';

interface PendingDelete {
  label: string;
  run: () => Promise<unknown>;
}

function RowActions({
  name,
  onEdit,
  onDelete,
}: {
  name: string;
  onEdit: () => void;
  onDelete: () => void;
}) {
  return (
    <div className="flex gap-2">
      <Button variant="secondary" size="sm" onClick={onEdit} aria-label={`Edit ${name}`}>
        Edit
      </Button>
      <Button variant="danger" size="sm" onClick={onDelete} aria-label={`Delete ${name}`}>
        Delete
      </Button>
    </div>
  );
}

/** The id API calls take for this item (`key.lightId`, `key.modifierId`, `gelKitId`…). */
function ApiId({ id, name }: { id: string; name: string }) {
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <code className="text-small text-ink-muted" title={id}>
        {id.slice(0, 8)}…
      </code>
      <CopyButton text={id} label="Copy id" ariaLabel={`Copy id of ${name}`} size="sm" />
    </span>
  );
}

/** A column with each item's API id, for the roles that build against the API. */
function idColumn<T extends { id: string; name: string }>(): DataColumn<T> {
  return {
    id: 'apiId',
    header: 'API id',
    cell: ({ row }) => <ApiId id={row.original.id} name={row.original.name} />,
  };
}

export function GearPage() {
  const canEdit = useCan('gear:manage');
  // Keys read the gear list too: developers copy these ids into their calls.
  const showIds = useCan('keys:manage-own');
  const lights = useLights();
  const modifiers = useModifiers();
  const gelKits = useGelKits();
  const deleteLight = useDeleteLight();
  const deleteModifier = useDeleteModifier();
  const deleteKit = useDeleteGelKit();
  const deletePiece = useDeleteGelPiece();
  const [editingLight, setEditingLight] = useState<Light | 'new' | null>(null);
  const [editingModifier, setEditingModifier] = useState<Modifier | 'new' | null>(null);
  const [editingPiece, setEditingPiece] = useState<GelPieceTarget | null>(null);
  const [pending, setPending] = useState<PendingDelete | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const [deleting, setDeleting] = useState(false);

  const lightColumns = useMemo<DataColumn<Light>[]>(() => {
    const columns: DataColumn<Light>[] = [
      { id: 'name', header: 'Name', accessorFn: (l) => l.name },
      {
        id: 'gn',
        header: 'Guide number (ISO 100)',
        accessorFn: (l) =>
          `${l.guideNumber} ${l.guideNumberUnit} (${l.guideNumberM.toFixed(1)} m / ${l.guideNumberFt.toFixed(0)} ft)`,
      },
      {
        id: 'source',
        header: 'From',
        accessorFn: (l) => (l.meterReading ? 'meter reading' : 'stated guide number'),
      },
      { id: 'notes', header: 'Notes', accessorFn: (l) => l.notes ?? '' },
    ];
    if (showIds) columns.push(idColumn<Light>());
    if (canEdit) {
      columns.push({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <RowActions
            name={row.original.name}
            onEdit={() => setEditingLight(row.original)}
            onDelete={() =>
              setPending({
                label: row.original.name,
                run: () => deleteLight.mutateAsync(row.original.id),
              })
            }
          />
        ),
      });
    }
    return columns;
    // eslint-disable-next-line react-hooks/exhaustive-deps -- mutation objects are stable
  }, [canEdit, showIds]);

  const modifierColumns = useMemo<DataColumn<Modifier>[]>(() => {
    const columns: DataColumn<Modifier>[] = [
      { id: 'name', header: 'Name', accessorFn: (m) => m.name },
      { id: 'kind', header: 'Kind', accessorFn: (m) => m.kind ?? '—' },
      { id: 'loss', header: 'Loss (stops)', accessorFn: (m) => m.lossStops },
      {
        id: 'size',
        header: 'Size',
        accessorFn: (m) => (m.size !== null ? `${m.size} ${m.sizeUnit ?? ''}` : '—'),
      },
      {
        id: 'beam',
        header: 'Beam angle',
        accessorFn: (m) => (m.beamAngleDeg !== null ? `${m.beamAngleDeg}°` : '—'),
      },
    ];
    if (showIds) columns.push(idColumn<Modifier>());
    if (canEdit) {
      columns.push({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <RowActions
            name={row.original.name}
            onEdit={() => setEditingModifier(row.original)}
            onDelete={() =>
              setPending({
                label: row.original.name,
                run: () => deleteModifier.mutateAsync(row.original.id),
              })
            }
          />
        ),
      });
    }
    return columns;
    // eslint-disable-next-line react-hooks/exhaustive-deps -- mutation objects are stable
  }, [canEdit, showIds]);

  const pieceColumns = (kit: GelKit): DataColumn<GelPiece>[] => {
    const columns: DataColumn<GelPiece>[] = [
      { id: 'name', header: 'Gel', accessorFn: (p) => p.name },
      { id: 'mired', header: 'Mired shift', accessorFn: (p) => p.miredShift },
      { id: 'green', header: 'Green shift (CC)', accessorFn: (p) => p.greenShift },
      { id: 'loss', header: 'Loss (stops)', accessorFn: (p) => p.lossStops },
    ];
    if (canEdit) {
      columns.push({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <RowActions
            name={row.original.name}
            onEdit={() => setEditingPiece({ kitId: kit.id, piece: row.original })}
            onDelete={() =>
              setPending({
                label: row.original.name,
                run: () => deletePiece.mutateAsync({ kitId: kit.id, pieceId: row.original.id }),
              })
            }
          />
        ),
      });
    }
    return columns;
  };

  const confirmDelete = async () => {
    if (!pending) return;
    setDeleting(true);
    setDeleteError(null);
    try {
      await pending.run();
      setPending(null);
    } catch (error) {
      setDeleteError(problemMessage(error));
    } finally {
      setDeleting(false);
    }
  };

  return (
    <div className="flex flex-col gap-8">
      {!canEdit ? (
        <Notice>Your role can read the gear list; an owner or admin keeps it up to date.</Notice>
      ) : null}
      <section aria-labelledby="lights-heading">
        <div className="mb-3 flex items-center justify-between gap-4">
          <h2 id="lights-heading" className="text-title font-semibold">
            Lights
          </h2>
          {canEdit ? <Button onClick={() => setEditingLight('new')}>Add light</Button> : null}
        </div>
        {lights.isPending ? (
          <PageLoading />
        ) : lights.isError ? (
          <LoadError error={lights.error} onRetry={lights.refetch} retrying={lights.isRefetching} />
        ) : (
          <DataTable
            caption="Lights"
            columns={lightColumns}
            data={lights.data.data}
            getRowId={(l) => l.id}
          />
        )}
      </section>
      <section aria-labelledby="modifiers-heading">
        <div className="mb-3 flex items-center justify-between gap-4">
          <h2 id="modifiers-heading" className="text-title font-semibold">
            Modifiers
          </h2>
          {canEdit ? <Button onClick={() => setEditingModifier('new')}>Add modifier</Button> : null}
        </div>
        {modifiers.isPending ? (
          <PageLoading />
        ) : modifiers.isError ? (
          <LoadError
            error={modifiers.error}
            onRetry={modifiers.refetch}
            retrying={modifiers.isRefetching}
          />
        ) : (
          <DataTable
            caption="Modifiers"
            columns={modifierColumns}
            data={modifiers.data.data}
            getRowId={(m) => m.id}
          />
        )}
      </section>
      <section aria-labelledby="gels-heading">
        <h2 id="gels-heading" className="mb-3 text-title font-semibold">
          Gel kits
        </h2>
        {gelKits.isPending ? (
          <PageLoading />
        ) : gelKits.isError ? (
          <LoadError
            error={gelKits.error}
            onRetry={gelKits.refetch}
            retrying={gelKits.isRefetching}
          />
        ) : (
          <div className="flex flex-col gap-4">
            {gelKits.data.data.map((kit) => (
              <Card key={kit.id} aria-label={`Gel kit ${kit.name}`}>
                <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
                  <div className="flex flex-wrap items-center gap-3">
                    <h3 className="text-lead font-semibold">{kit.name}</h3>
                    {showIds ? <ApiId id={kit.id} name={kit.name} /> : null}
                  </div>
                  {canEdit ? (
                    <div className="flex gap-2">
                      <Button
                        variant="secondary"
                        size="sm"
                        onClick={() => setEditingPiece({ kitId: kit.id, piece: 'new' })}
                      >
                        Add gel to {kit.name}
                      </Button>
                      <Button
                        variant="danger"
                        size="sm"
                        onClick={() =>
                          setPending({ label: kit.name, run: () => deleteKit.mutateAsync(kit.id) })
                        }
                      >
                        Delete kit
                      </Button>
                    </div>
                  ) : null}
                </div>
                <DataTable
                  caption={`Gels in ${kit.name}`}
                  columns={pieceColumns(kit)}
                  data={kit.pieces}
                  getRowId={(p) => p.id}
                  empty="No gels in this kit yet."
                />
              </Card>
            ))}
            {gelKits.data.data.length === 0 ? (
              <p className="text-ink-muted">No gel kits yet.</p>
            ) : null}
            {canEdit ? <NewGelKitForm /> : null}
          </div>
        )}
      </section>
      <LightDialog light={editingLight} onClose={() => setEditingLight(null)} />
      <ModifierDialog modifier={editingModifier} onClose={() => setEditingModifier(null)} />
      <GelPieceDialog target={editingPiece} onClose={() => setEditingPiece(null)} />
      <ConfirmDialog
        open={pending !== null}
        title={`Delete ${pending?.label ?? ''}?`}
        description="This removes it from the studio’s gear list."
        confirmLabel="Delete"
        pending={deleting}
        error={deleteError}
        onClose={() => {
          setPending(null);
          setDeleteError(null);
        }}
        onConfirm={() => void confirmDelete()}
      />
    </div>
  );
}

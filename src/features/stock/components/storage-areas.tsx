import { useEffect, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { SkeletonRows } from '../../../components/ui/skeleton';
import { useToast } from '../../../components/ui/toast';
import { isApiError } from '../../../lib/api-client';
import { storageAreaName } from '../../../shared/schemas/stock';
import { useCreateStorageArea, useDeleteStorageArea, useRenameStorageArea, useReorderStorageAreas } from '../api/change-storage-areas';
import { useStorageAreas, type StorageArea } from '../api/get-storage-areas';

const packs = (n: number) => (n === 1 ? '1 pack' : `${n} packs`);

/** The server's word on a name (taken, too long), else the schema's, else a plain retry. */
function problemOf(err: unknown): string {
  if (isApiError(err)) return err.fields.name ?? Object.values(err.fields)[0] ?? err.message;
  return 'That did not save. Try again.';
}

/** The name as the server will take it, or the reason it will not. */
function checkName(raw: string): { name: string } | { problem: string } {
  const r = storageAreaName.safeParse(raw);
  return r.success ? { name: r.data } : { problem: r.error.issues[0]?.message ?? 'Check the name.' };
}

function AddArea({ siteId, onChanged }: { siteId: string; onChanged?: () => void }) {
  const [name, setName] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const create = useCreateStorageArea(onChanged);
  const { notify } = useToast();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const checked = checkName(name);
    if ('problem' in checked) return setProblem(checked.problem);
    setProblem(null);
    create.mutate(
      { siteId, name: checked.name },
      {
        onSuccess: (r) => {
          setName('');
          notify(`${r.area.name} added.`);
        },
        onError: (err) => setProblem(problemOf(err)),
      },
    );
  };
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3" aria-label="Add a storage area">
      <Field label="New storage area" error={problem ?? undefined} className="min-w-64 flex-1 sm:max-w-sm">
        <Input value={name} onChange={(e) => setName(e.target.value)} placeholder="e.g. Walk-in fridge" autoComplete="off" />
      </Field>
      <Button type="submit" busy={create.isPending} className={problem ? 'mb-7' : undefined}>
        Add area
      </Button>
    </form>
  );
}

function RenameArea({ siteId, area, onDone, onChanged }: { siteId: string; area: StorageArea; onDone: () => void; onChanged?: () => void }) {
  const [name, setName] = useState(area.name);
  const [problem, setProblem] = useState<string | null>(null);
  const rename = useRenameStorageArea(onChanged);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const checked = checkName(name);
    if ('problem' in checked) return setProblem(checked.problem);
    if (checked.name === area.name) return onDone();
    rename.mutate({ siteId, areaId: area.id, name: checked.name }, { onSuccess: onDone, onError: (err) => setProblem(problemOf(err)) });
  };
  return (
    <form onSubmit={submit} className="flex flex-1 flex-wrap items-end gap-2" aria-label={`Rename ${area.name}`}>
      <Field label={`New name for ${area.name}`} error={problem ?? undefined} className="min-w-56 flex-1">
        <Input
          value={name}
          autoFocus
          onChange={(e) => setName(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Escape') onDone();
          }}
        />
      </Field>
      <div className={problem ? 'mb-7 flex gap-2' : 'flex gap-2'}>
        <Button type="submit" size="sm" busy={rename.isPending}>
          Save name
        </Button>
        <Button size="sm" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/**
 * The places packs are kept at a site, in the order the count sheet walks them: add, rename,
 * move up or down, delete (its packs stay stocked, in no area). For the owner and manager.
 */
export function StorageAreas({ siteId, onChanged }: { siteId: string; onChanged?: () => void }) {
  const areas = useStorageAreas(siteId);
  const reorder = useReorderStorageAreas(onChanged);
  const remove = useDeleteStorageArea(onChanged);
  const { notify } = useToast();
  const [renaming, setRenaming] = useState<string | null>(null);
  const [deleting, setDeleting] = useState<StorageArea | null>(null);
  // After an inline rename, focus goes back to that area's Rename button.
  const renameButtons = useRef(new Map<string, HTMLButtonElement>());
  const lastRenamed = useRef<string | null>(null);
  useEffect(() => {
    if (renaming) lastRenamed.current = renaming;
    else if (lastRenamed.current) {
      renameButtons.current.get(lastRenamed.current)?.focus();
      lastRenamed.current = null;
    }
  }, [renaming]);

  if (areas.isPending) return <SkeletonRows rows={3} label="Loading the storage areas" />;
  if (areas.isError) return <ErrorState error={areas.error} onRetry={() => areas.refetch()} />;
  const list = areas.data.areas;

  const move = (index: number, by: -1 | 1) => {
    const to = index + by;
    if (to < 0 || to >= list.length || reorder.isPending) return;
    const ids = list.map((a) => a.id);
    [ids[index], ids[to]] = [ids[to], ids[index]];
    reorder.mutate({ siteId, areaIds: ids }, { onError: (err) => notify(isApiError(err) ? (Object.values(err.fields)[0] ?? err.message) : 'The new order did not save. Try again.') });
  };

  return (
    <div className="flex flex-col gap-4">
      <p className="max-w-prose text-sm text-muted">
        Name the places you keep stock and put them in the order you walk them: each count sheet lists the packs area by area, in this order. Choose each pack&apos;s area in the stock table.
      </p>
      {list.length === 0 ? (
        <EmptyState title="No storage areas yet" next="Add the places you keep stock (a fridge, behind the bar, a dry store); until then the count sheet lists every pack under “Not in an area”." />
      ) : (
        <ol className="flex flex-col rounded-lg border border-rule" aria-label="Storage areas, in counting order">
          {list.map((a, i) => (
            <li key={a.id} data-area={a.id} className="flex flex-wrap items-center gap-3 border-rule px-4 py-3 not-first:border-t">
              <span className="w-6 text-right tabular-nums text-muted" aria-hidden="true">
                {i + 1}.
              </span>
              {renaming === a.id ? (
                <RenameArea siteId={siteId} area={a} onDone={() => setRenaming(null)} onChanged={onChanged} />
              ) : (
                <>
                  <span className="min-w-40 flex-1">
                    <span className="font-medium text-ink">{a.name}</span> <span className="text-sm text-muted">· {a.packCount === 0 ? 'no packs yet' : packs(a.packCount)}</span>
                  </span>
                  <div className="flex flex-wrap gap-2">
                    <Button size="sm" variant="secondary" aria-label={`Move ${a.name} up`} aria-disabled={i === 0 || undefined} className={i === 0 ? 'opacity-50' : undefined} onClick={() => move(i, -1)}>
                      Up
                    </Button>
                    <Button size="sm" variant="secondary" aria-label={`Move ${a.name} down`} aria-disabled={i === list.length - 1 || undefined} className={i === list.length - 1 ? 'opacity-50' : undefined} onClick={() => move(i, 1)}>
                      Down
                    </Button>
                    <Button
                      size="sm"
                      variant="secondary"
                      aria-label={`Rename ${a.name}`}
                      ref={(el) => {
                        if (el) renameButtons.current.set(a.id, el);
                        else renameButtons.current.delete(a.id);
                      }}
                      onClick={() => setRenaming(a.id)}
                    >
                      Rename
                    </Button>
                    <Button size="sm" variant="quiet" aria-label={`Delete ${a.name}`} onClick={() => setDeleting(a)}>
                      Delete
                    </Button>
                  </div>
                </>
              )}
            </li>
          ))}
        </ol>
      )}
      <AddArea siteId={siteId} onChanged={onChanged} />
      <ConfirmDialog
        open={deleting !== null}
        title={deleting ? `Delete ${deleting.name}?` : 'Delete the area?'}
        consequence={
          deleting && (
            <p>
              {deleting.packCount === 0
                ? 'No pack is kept there. '
                : deleting.packCount === 1
                  ? 'The 1 pack kept there stays in stock but becomes unassigned: count sheets list it under “Not in an area” until you choose another area for it. '
                  : `The ${deleting.packCount} packs kept there stay in stock but become unassigned: count sheets list them under “Not in an area” until you choose another area for them. `}
              Counts already taken there no longer name the area (their quantities and values stay).
            </p>
          )
        }
        confirmLabel="Delete area"
        busy={remove.isPending}
        error={remove.error ? problemOf(remove.error) : undefined}
        onCancel={() => {
          setDeleting(null);
          remove.reset();
        }}
        onConfirm={() =>
          deleting &&
          remove.mutate(
            { siteId, areaId: deleting.id },
            {
              onSuccess: () => {
                notify(`${deleting.name} deleted.`);
                setDeleting(null);
              },
            },
          )
        }
      />
    </div>
  );
}

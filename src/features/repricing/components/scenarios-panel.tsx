import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { StatusMark } from '../../../components/ui/status-mark';
import { formatDate } from '../../../lib/format';
import { useScenarios } from '../api/scenarios';
import type { Scenario } from '../api/types';

interface Props {
  canSave: boolean;
  openId: string | null;
  saving: boolean;
  saveError: string | null;
  onSave: (name: string) => void;
  onOpen: (s: Scenario) => void;
  onCompare: (ids: string[]) => void;
  onDelete: (s: Scenario) => void;
}

/** Save what is on screen as a named draft; open, compare or remove drafts. Drafts change nothing live. */
export function ScenariosPanel({ canSave, openId, saving, saveError, onSave, onOpen, onCompare, onDelete }: Props) {
  const list = useScenarios();
  const [name, setName] = useState('');
  const [picked, setPicked] = useState<string[]>([]);
  const scenarios = list.data?.scenarios ?? [];
  return (
    <div className="flex flex-col gap-4">
      {canSave && (
        <form
          className="flex flex-wrap items-end gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (name.trim()) onSave(name.trim());
          }}
        >
          <Field label="Scenario name" hint="For example: absorb it, pass it on, large sizes only." error={saveError ?? undefined} className="w-72">
            <Input value={name} onChange={(e) => setName(e.target.value)} maxLength={120} />
          </Field>
          <Button type="submit" variant="secondary" busy={saving} disabled={!name.trim()}>
            {openId ? 'Save as a new draft' : 'Save as a draft'}
          </Button>
        </form>
      )}
      {scenarios.length === 0 ? (
        <p className="text-muted">No scenarios yet. Save one to try another way and compare them side by side.</p>
      ) : (
        <>
          <ul className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card">
            {scenarios.map((s) => (
              <li key={s.id} className="flex flex-wrap items-center gap-3 px-4 py-2">
                <input
                  type="checkbox"
                  id={`cmp-${s.id}`}
                  checked={picked.includes(s.id)}
                  onChange={(e) => setPicked((p) => (e.target.checked ? [...p, s.id] : p.filter((x) => x !== s.id)))}
                  className="h-4 w-4 accent-copper"
                />
                <label htmlFor={`cmp-${s.id}`} className="min-w-0 flex-1">
                  <span className="font-medium">{s.name}</span>{' '}
                  <span className="text-sm text-muted">
                    {s.changes.length} change{s.changes.length === 1 ? '' : 's'}, saved {formatDate(s.updatedAt)}
                    {s.createdBy ? ` by ${s.createdBy}` : ''}
                  </span>
                </label>
                {s.status === 'applied' ? (
                  <StatusMark tone="good">Applied {s.effectiveFrom ? `from ${formatDate(s.effectiveFrom)}` : ''}</StatusMark>
                ) : (
                  <StatusMark tone="info">Draft</StatusMark>
                )}
                {s.status === 'draft' && (
                  <>
                    <Button size="sm" variant="secondary" onClick={() => onOpen(s)} aria-label={`Open ${s.name}`}>
                      {openId === s.id ? 'Open now' : 'Open'}
                    </Button>
                    {canSave && (
                      <Button size="sm" variant="quiet" onClick={() => onDelete(s)} aria-label={`Remove ${s.name}`}>
                        Remove
                      </Button>
                    )}
                  </>
                )}
              </li>
            ))}
          </ul>
          <div>
            <Button variant="secondary" size="sm" disabled={picked.length < 2} onClick={() => onCompare(picked)}>
              Compare {picked.length >= 2 ? picked.length : ''} side by side
            </Button>
          </div>
        </>
      )}
    </div>
  );
}

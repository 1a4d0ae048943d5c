import { useEffect, useId } from 'react';
import { Select } from '../../components/ui/input';
import { Skeleton } from '../../components/ui/skeleton';
import { useStoredSiteId } from '../../lib/current-site';
import { useSites } from '../../features/sites/api/get-sites';

/** Which site the user is working at; the choice is kept per business in this browser. */
export function SiteSwitcher({ businessId }: { businessId: string }) {
  const sites = useSites();
  const [storedId, setStoredId] = useStoredSiteId(businessId);
  const id = useId();
  const list = sites.data?.sites ?? [];
  const current = list.find((s) => s.id === storedId) ?? list[0];

  // Keep the stored choice valid: the first site when none (or a removed one) was chosen.
  useEffect(() => {
    if (current && current.id !== storedId) setStoredId(current.id);
  }, [current, storedId, setStoredId]);

  if (sites.isPending) return <Skeleton className="h-8 w-32" />;
  if (sites.isError || !current) return null;
  if (list.length === 1)
    return (
      <p className="text-sm text-muted">
        <span className="sr-only">Site: </span>
        {current.name}
      </p>
    );
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm text-muted">
        Site
      </label>
      <Select id={id} value={current.id} onChange={(e) => setStoredId(e.target.value)} className="max-w-48 py-1 text-sm">
        {list.map((s) => (
          <option key={s.id} value={s.id}>
            {s.name}
          </option>
        ))}
      </Select>
    </div>
  );
}

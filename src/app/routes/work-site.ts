import { useMe } from '../../features/auth/api/get-me';
import { useSites } from '../../features/sites/api/get-sites';
import { useStoredSiteId } from '../../lib/current-site';

/** The site chosen in the top bar (the first site until one is chosen), the sites and the user's role. */
export function useWorkSite() {
  const me = useMe();
  const sites = useSites();
  const [stored] = useStoredSiteId(me.data?.business.id);
  const list = sites.data?.sites ?? [];
  const site = list.find((s) => s.id === stored) ?? list[0] ?? null;
  return { site, sites: list, role: me.data?.user.role ?? null, pending: me.isPending || sites.isPending, error: sites.error };
}

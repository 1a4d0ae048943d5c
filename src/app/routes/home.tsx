import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { TextLink } from '../../components/ui/button';
import { ROLE_LABELS as roleLabels, type Role } from '../../shared/capabilities';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { entriesFor } from '../navigation';
import { CardsSection } from './cards';

const welcome: Record<Role, string> = {
  owner: 'You run the business here: its team, its settings, and everything the others can do.',
  manager: 'You look after the menu, its costs, suppliers, orders and stock.',
  bookkeeper: 'You see the sales, the cost of goods and the month-end figures.',
  barista: 'Your recipe cards and stock counts, sized for your phone.',
};

export function HomeRoute() {
  const me = useMe();
  if (!me.data) return null;
  const { user } = me.data;
  const sections = entriesFor(user.role).filter((e) => e.path !== paths.home.path);
  const firstName = user.name.split(/\s+/)[0] || user.name;

  if (user.role === 'barista')
    return (
      <div className="max-w-5xl text-xl">
        <PageHeader title={`Hello, ${firstName}`} description="Tap a drink to open its recipe card." />
        <CardsSection />
      </div>
    );

  return (
    <div className="max-w-3xl">
      <PageHeader title={`Welcome, ${firstName}`} description={`You are signed in as ${roleLabels[user.role].toLowerCase()} of ${me.data.business.name}.`} />
      <p className="text-ink">{welcome[user.role]}</p>
      {sections.length > 0 && (
        <ul className="mt-6 grid gap-4 sm:grid-cols-2">
          {sections.map((e) => (
            <li key={e.path}>
              <Card className="h-full">
                <h2 className="font-bold">
                  <TextLink to={e.href()}>{e.label}</TextLink>
                </h2>
                <p className="mt-1 text-muted">{e.does}</p>
              </Card>
            </li>
          ))}
        </ul>
      )}
      {user.role === 'owner' && (
        <p className="mt-6 text-muted">
          New here? <TextLink to={paths.gettingStarted.href()}>Follow the three first steps</TextLink>.
        </p>
      )}
    </div>
  );
}

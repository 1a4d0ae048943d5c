import { useId } from 'react';
import { NavLink } from 'react-router-dom';
import { cx, focusRing } from '../../components/ui/cx';
import { type Role } from '../../shared/capabilities';
import { groupsFor, type NavEntry } from '../navigation';

function Entry({ e, large, onNavigate }: { e: NavEntry; large: boolean; onNavigate?: () => void }) {
  return (
    <li>
      <NavLink
        to={e.href()}
        end={e.path === '/'}
        onClick={onNavigate}
        className={({ isActive }) =>
          cx(
            'block rounded-md px-3 py-1.5 font-medium no-underline',
            focusRing,
            isActive ? 'border-l-4 border-copper bg-card font-bold text-ink' : 'border-l-4 border-transparent text-ink hover:bg-rule/50',
            large && 'py-3 text-lg',
          )
        }
      >
        {e.label}
      </NavLink>
    </li>
  );
}

/** The section links this role may use, in their groups; a column on wide screens, a list in the phone menu. */
export function SideNav({ role, onNavigate }: { role: Role; onNavigate?: () => void }) {
  const id = useId();
  // The bar's few pages read large on a phone.
  const large = role === 'barista';
  return (
    <div className="flex flex-col gap-4">
      {groupsFor(role).map(({ group, entries }, i) => (
        <div key={group ?? 'home'}>
          {group && (
            <p id={`${id}-${i}`} className="mb-1 px-3 text-xs font-bold uppercase tracking-wide text-muted">
              {group}
            </p>
          )}
          <ul className="flex flex-col gap-0.5" aria-labelledby={group ? `${id}-${i}` : undefined}>
            {entries.map((e) => (
              <Entry key={e.path} e={e} large={large} onNavigate={onNavigate} />
            ))}
          </ul>
        </div>
      ))}
    </div>
  );
}

import { NavLink } from 'react-router-dom';
import { cx, focusRing } from '../../components/ui/cx';
import { type Role } from '../../shared/capabilities';
import { entriesFor } from '../navigation';

/** The section links this role may use; a column on wide screens, a list in the phone menu. */
export function SideNav({ role, onNavigate }: { role: Role; onNavigate?: () => void }) {
  return (
    <ul className="flex flex-col gap-1">
      {entriesFor(role).map((e) => (
        <li key={e.path}>
          <NavLink
            to={e.href()}
            end={e.path === '/'}
            onClick={onNavigate}
            className={({ isActive }) =>
              cx(
                'block rounded-md px-3 py-2 font-medium no-underline',
                focusRing,
                isActive ? 'border-l-4 border-copper bg-card font-bold text-ink' : 'border-l-4 border-transparent text-ink hover:bg-rule/50',
                role === 'barista' && 'py-3 text-lg',
              )
            }
          >
            {e.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}

import { useEffect, useId, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { cx, focusRing } from '../../components/ui/cx';
import { ROLE_LABELS as roleLabels } from '../../shared/capabilities';
import { type User } from '../../shared/contract/auth';
import { paths } from '../../lib/paths';
import { useLogout } from '../../features/auth/api/logout';

/** The signed-in person: name and role, and the way to sign out. */
export function UserMenu({ user }: { user: User }) {
  const [open, setOpen] = useState(false);
  const logout = useLogout();
  const navigate = useNavigate();
  const menuId = useId();
  const wrapper = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!wrapper.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpen(false);
        button.current?.focus();
      }
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const initials = user.name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((w) => w[0]?.toUpperCase())
    .join('');

  return (
    <div ref={wrapper} className="relative">
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={menuId}
        onClick={() => setOpen((o) => !o)}
        className={cx('flex items-center gap-2 rounded-md px-2 py-1 text-sm text-ink hover:bg-rule/50', focusRing)}
      >
        <span aria-hidden="true" className="flex h-8 w-8 items-center justify-center rounded-full bg-slate text-xs font-bold text-white">
          {initials || '?'}
        </span>
        <span className="hidden text-left sm:block">
          <span className="block font-medium leading-tight">{user.name}</span>
          <span className="block text-xs leading-tight text-muted">{roleLabels[user.role]}</span>
        </span>
        <span className="sr-only sm:hidden">
          {user.name}, {roleLabels[user.role]}: account
        </span>
      </button>
      {open && (
        <div id={menuId} className="absolute right-0 z-30 mt-2 w-64 rounded-lg border border-rule bg-card p-4 shadow-lg">
          <p className="font-medium text-ink">{user.name}</p>
          <p className="break-all text-sm text-muted">{user.email}</p>
          <p className="mt-1 text-sm text-ink">Role: {roleLabels[user.role]}</p>
          <Button
            variant="secondary"
            className="mt-4 w-full"
            busy={logout.isPending}
            onClick={() => logout.mutate({}, { onSettled: () => navigate(paths.signIn.href(), { replace: true }) })}
          >
            Sign out
          </Button>
        </div>
      )}
    </div>
  );
}

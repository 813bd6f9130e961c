import { NavLink, Outlet, useNavigate } from 'react-router';
import { Button } from '../components/ui/button.tsx';
import { Logo } from '../components/ui/logo.tsx';
import { NAV_ITEMS } from '../config/nav.ts';
import { hasScope, useMe } from '../api/me.ts';
import { useLogout } from '../features/auth/api/session.ts';
import { paths } from '../config/paths.ts';

export function ConsoleLayout() {
  const { data: me } = useMe();
  const logout = useLogout();
  const navigate = useNavigate();
  const items = NAV_ITEMS.filter((item) => !item.scope || hasScope(me, item.scope));

  return (
    <div className="flex min-h-screen">
      <aside className="flex w-60 shrink-0 flex-col bg-slag-900 text-ash-100">
        <div className="flex items-center gap-2.5 px-5 py-5">
          <Logo />
          <div>
            <p className="font-semibold leading-none tracking-tight">Meltwire</p>
            <p className="mt-1 font-mono text-[10px] uppercase tracking-widest text-slag-300">console</p>
          </div>
        </div>
        <nav aria-label="Main" className="flex-1 px-3">
          <ul className="space-y-0.5">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  end={item.end}
                  className={({ isActive }) =>
                    `block rounded-md px-3 py-2 text-sm ${isActive ? 'bg-slag-800 font-medium text-white shadow-[inset_3px_0_0_var(--color-ember-500)]' : 'text-slag-300 hover:bg-slag-800 hover:text-white'}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        {me && (
          <div className="border-t border-slag-800 px-5 py-4 text-sm">
            <p className="truncate font-medium" title={me.user.email}>
              {me.user.name}
            </p>
            <p className="truncate text-xs text-slag-300">{me.user.email}</p>
            <p className="mt-1 font-mono text-xs text-ember-400" data-testid="current-role">
              {me.user.role}
            </p>
            <NavLink to={paths.myAlerts} className="mt-2 block text-xs text-ash-100 underline hover:text-white">
              My alerts
            </NavLink>
            <Button
              variant="ghost"
              className="mt-3 w-full !text-ash-100 hover:!bg-slag-800"
              disabled={logout.isPending}
              onClick={() => logout.mutate(undefined, { onSettled: () => navigate(paths.signIn) })}
            >
              Sign out
            </Button>
          </div>
        )}
      </aside>
      <main className="min-w-0 flex-1 px-8 py-8">
        <Outlet />
      </main>
    </div>
  );
}

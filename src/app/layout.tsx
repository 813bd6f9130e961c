import { NavLink, Outlet, useNavigate } from 'react-router';
import { Button } from '../components/ui/button.tsx';
import { Logo } from '../components/ui/logo.tsx';
import { navSections } from '../config/nav.ts';
import { hasScope, useMe } from '../api/me.ts';
import { useLogout } from '../features/auth/api/session.ts';
import { paths } from '../config/paths.ts';
import { useNavCollapsed } from './use-nav-collapsed.ts';

const NAV_ID = 'main-navigation';

function MenuIcon() {
  return (
    <svg viewBox="0 0 20 20" className="h-5 w-5" aria-hidden>
      <path d="M3 5h14M3 10h14M3 15h14" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}

export function ConsoleLayout() {
  const { data: me } = useMe();
  const logout = useLogout();
  const navigate = useNavigate();
  const { collapsed, toggle, collapse } = useNavCollapsed();
  const sections = navSections((scope) => hasScope(me, scope));

  return (
    <div className="min-h-screen">
      <aside
        className={`fixed inset-y-0 left-0 z-30 flex flex-col overflow-y-auto bg-slag-900 text-ash-100 ${collapsed ? 'w-14' : 'w-56 max-md:shadow-2xl'}`}
      >
        <div className={`flex items-center gap-2.5 py-4 ${collapsed ? 'flex-col px-2' : 'px-4'}`}>
          <button
            type="button"
            className="rounded-md p-2 text-ash-100 hover:bg-slag-800 focus:outline-none focus-visible:ring-2 focus-visible:ring-ember-500"
            aria-label="Navigation"
            aria-expanded={!collapsed}
            aria-controls={NAV_ID}
            title={collapsed ? 'Show the navigation' : 'Hide the navigation'}
            onClick={toggle}
          >
            <MenuIcon />
          </button>
          <Logo className={collapsed ? 'h-6 w-6' : 'h-7 w-7'} />
          {!collapsed && (
            <div>
              <p className="font-semibold leading-none tracking-tight">Meltwire</p>
              <p className="mt-1 font-mono text-[10px] uppercase tracking-widest text-slag-300">console</p>
            </div>
          )}
        </div>
        <nav id={NAV_ID} aria-label="Main" hidden={collapsed} className="flex-1 px-3">
          {sections.map((section) => (
            <div key={section.group} className="mb-3">
              <p className="px-3 pb-1 text-[10px] font-semibold uppercase tracking-widest text-slag-400">{section.group}</p>
              <ul className="space-y-0.5">
                {section.items.map((item) => (
                  <li key={item.to}>
                    <NavLink
                      to={item.to}
                      end={item.end}
                      className={({ isActive }) =>
                        `block rounded-md px-3 py-1.5 text-sm ${isActive ? 'bg-slag-800 font-medium text-white shadow-[inset_3px_0_0_var(--color-ember-500)]' : 'text-slag-300 hover:bg-slag-800 hover:text-white'}`
                      }
                    >
                      {item.label}
                    </NavLink>
                  </li>
                ))}
              </ul>
            </div>
          ))}
        </nav>
        {me && !collapsed && (
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
      {/* On a phone-sized screen the open navigation lies over the page; a tap beside it folds it away. */}
      {!collapsed && <div className="fixed inset-0 z-20 bg-slag-900/40 md:hidden" aria-hidden onClick={collapse} />}
      <main className={`min-w-0 px-4 py-6 md:px-6 lg:px-8 lg:py-8 ${collapsed ? 'ml-14' : 'ml-14 md:ml-56'}`}>
        <Outlet />
      </main>
    </div>
  );
}

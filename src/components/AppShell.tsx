/**
 * The frame around every page: a slim top bar (brand, navigation, the
 * signed-in person) and the page below it, filling the window height so the
 * workspace can lay out its editor and panes without page scroll.
 */
import { Link, NavLink, Outlet, useNavigation } from 'react-router';
import { useMe } from '../api/useAuth';
import { BrandMark } from './BrandMark';

function navClass({ isActive }: { isActive: boolean }) {
  return `rounded-stitch px-2.5 py-1.5 text-sm font-medium ${
    isActive ? 'bg-lavender-100 text-lavender-800' : 'text-tide-700 hover:bg-tide-100 hover:text-tide-900'
  }`;
}

/** Layout route rendered around every page. */
export function AppShell() {
  const me = useMe();
  const navigation = useNavigation();
  const user = me.data;
  return (
    <div className="flex h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded-stitch focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="no-print flex h-bar shrink-0 items-center gap-4 border-b border-tide-200 bg-white px-4">
        <Link to={user ? '/patterns' : '/sign-in'} className="flex items-center gap-2 rounded-stitch text-tide-900">
          <BrandMark />
          <span className="text-[1.05rem] font-semibold tracking-tight">Loopwright</span>
        </Link>
        <nav aria-label="Main" className="flex items-center gap-1">
          {user && <NavLink to="/patterns" end className={navClass}>Patterns</NavLink>}
          <NavLink to="/shop" className={navClass}>Shop</NavLink>
          {user?.roles.includes('designer') && <NavLink to="/sales" className={navClass}>Sales</NavLink>}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          {navigation.state === 'loading' && (
            <span role="status" className="text-caption text-tide-600">Loading…</span>
          )}
          {user ? (
            <NavLink to="/account" className={navClass} title="Account settings">
              <span className="sr-only">Account settings for </span>
              {user.name}
            </NavLink>
          ) : (
            me.isSuccess && <NavLink to="/sign-in" className={navClass}>Sign in</NavLink>
          )}
        </div>
      </header>
      <main id="main" className="flex min-h-0 flex-1 flex-col">
        <Outlet />
      </main>
    </div>
  );
}

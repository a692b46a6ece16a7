import { Navigate, Outlet, useLocation, useNavigate, useSearchParams } from 'react-router';
import { rememberedUnitId } from '../../components/readings/unit-picker';
import { lazy, Suspense, useState } from 'react';
import { roleLabels } from '../../../shared/roles';
import { useMe, useSignOut } from '../../features/session';
import { Notice } from '../../components/ui/notice';
import { applyTheme, initialTheme, type Theme } from '../../lib/theme';
import { navigationGroupsFor } from '../navigation';
import { MainNav } from './main-nav';
import { useConnected, useLiveUpdates } from '../use-live-updates';
import { PendingOrdersPrompt } from '../../features/orders';
import { Button } from '../../components/ui/button';
import { loadOfflineStatus } from '../../features/offline/shell';

const OfflineStatus = lazy(async () => ({ default: await loadOfflineStatus() }));

export function AppShell() {
  const { data: me, isPending, error } = useMe();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const [params] = useSearchParams();
  // The menu carries the unit being looked at, so moving between pages never falls back to Unit 1.
  const unit = params.get('unit') ?? rememberedUnitId()?.toString() ?? null;
  const withUnit = (to: string) => (unit && to !== '/account/password' && !to.startsWith('/admin') ? { pathname: to, search: `?unit=${unit}` } : to);
  const [theme, setTheme] = useState<Theme>(initialTheme);
  useLiveUpdates(Boolean(me && !me.mustChangePassword));
  const connected = useConnected(Boolean(me && !me.mustChangePassword));

  if (isPending) return <p className="p-8 text-muted">Loading…</p>;
  if (error) return <div className="p-8"><Notice kind="error">{error.message}</Notice></div>;
  if (!me) {
    const next = location.pathname === '/' ? '' : `?next=${encodeURIComponent(location.pathname)}`;
    return <Navigate to={`/sign-in${next}`} replace />;
  }
  if (me.mustChangePassword && location.pathname !== '/account/password') {
    return <Navigate to="/account/password" replace />;
  }

  const toggleTheme = () => {
    const next = theme === 'dark' ? 'light' : 'dark';
    applyTheme(next);
    setTheme(next);
  };

  return (
    <div className="min-h-screen">
      <header className="relative border-b border-line bg-panel print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-3 gap-y-1 px-4 py-2 xl:max-w-7xl xl:gap-y-2 xl:py-3">
          <span className="text-xl font-bold tracking-wide">Hotwell</span>
          <MainNav groups={navigationGroupsFor(me.role)} linkTo={withUnit} />
          {/* On a phone the name goes to a line of its own under the buttons, so the first line keeps Menu, name of the app and both buttons. */}
          <span data-testid="signed-in-as" className="order-last w-full text-right text-xs sm:order-none sm:ml-auto sm:w-auto sm:text-sm">
            {me.name} · {roleLabels[me.role]}
            {me.crewName ? ` · Crew ${me.crewName}` : ''}
          </span>
          <div className="ml-auto flex items-center gap-2 text-sm sm:ml-0">
            <Suspense fallback={null}>
              <OfflineStatus userId={me.id} />
            </Suspense>
            <Button tone="toggle" onClick={toggleTheme}>
              {theme === 'dark' ? '☀ Light' : '☾ Dark'}
            </Button>
            <Button tone="plain" size="xs" onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}>
              Sign out
            </Button>
          </div>
        </div>
      </header>
      {connected ? null : (
        <p role="status" className="border-b-2 border-watch bg-panel px-4 py-2 text-center font-bold print:hidden" data-testid="offline">
          ▲ Not connected to the server — this page is not being updated and may be out of date; rounds and log entries are kept on this device and sent when it is back; other changes are not saved until then.
        </p>
      )}
      <div className="print:hidden">
        <PendingOrdersPrompt enabled={!me.mustChangePassword} />
      </div>
      <main className="mx-auto max-w-6xl px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}

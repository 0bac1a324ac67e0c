import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { NavLink, Outlet } from 'react-router';
import { seedDemoBookOnce, seedDemoScenariosOnce } from '../store/demo-seed';
import { ServiceStatus } from './ServiceStatus';
import { SessionBar } from './SessionBar';
import { ThemeToggle } from './ThemeToggle';
import { UpdatePrompt } from './UpdatePrompt';

const PAGES = [
  { to: '/', label: 'Sketch', end: true },
  { to: '/book', label: 'Book' },
  { to: '/fit', label: 'Fit' },
  { to: '/paths', label: 'Paths' },
  { to: '/replay', label: 'Replay' },
  { to: '/library', label: 'Library' },
  { to: '/desk', label: 'Desk' },
];

export function AppShell() {
  const qc = useQueryClient();
  useEffect(() => {
    void (async () => {
      const scenarios = await seedDemoScenariosOnce();
      const book = await seedDemoBookOnce();
      if (scenarios || book) void qc.invalidateQueries({ queryKey: ['local'] });
    })();
  }, [qc]);
  return (
    <div className="min-h-screen">
      <UpdatePrompt />
      <header className="border-b border-rule bg-panel/60">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-8 gap-y-2 px-6 py-3">
          <NavLink to="/" className="flex items-baseline gap-2" aria-label="Saltation home">
            <span className="text-xl font-bold tracking-tight text-teal">Saltation</span>
            <span className="hidden text-sm text-muted md:inline">smiles with jumps</span>
          </NavLink>
          <nav aria-label="Pages" className="flex flex-wrap gap-1">
            {PAGES.map((p) => (
              <NavLink
                key={p.to}
                to={p.to}
                end={p.end}
                className={({ isActive }) =>
                  `rounded-full px-3 py-1 text-[15px] ${
                    isActive ? 'bg-teal text-paper' : 'text-ink/80 hover:bg-rule/60'
                  }`
                }
              >
                {p.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-4">
            <ServiceStatus />
            <SessionBar />
            <ThemeToggle />
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-6 py-6">
        <Outlet />
      </main>
    </div>
  );
}

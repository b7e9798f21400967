import { Link, NavLink, Outlet } from 'react-router-dom';
import { ThemeToggle } from './ThemeToggle';
import { AccountMenu } from '../cloud/AccountMenu';

const navClass = ({ isActive }: { isActive: boolean }) =>
  `px-2 py-1 rounded text-sm ${isActive ? 'text-ink font-medium bg-sunken' : 'text-ink-muted hover:text-ink'}`;

export function Layout() {
  return (
    <div className="flex h-full flex-col">
      <header className="flex h-12 shrink-0 items-center gap-4 border-b border-rule bg-panel px-4">
        <Link to="/" className="flex items-center gap-2 font-semibold tracking-tight" aria-label="Tapline home">
          <img src="/favicon.svg" alt="" className="h-6 w-6" />
          <span>Tapline</span>
        </Link>
        <nav className="flex items-center gap-1" aria-label="Main">
          <NavLink to="/" end className={navClass}>Home</NavLink>
          <NavLink to="/sheets/local" className={navClass}>Local sheet</NavLink>
          <NavLink to="/projects" className={navClass}>Projects</NavLink>
        </nav>
        <div className="ml-auto flex items-center gap-2">
          <AccountMenu />
          <ThemeToggle />
        </div>
      </header>
      <main className="min-h-0 flex-1">
        <Outlet />
      </main>
    </div>
  );
}

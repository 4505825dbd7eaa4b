import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Link, NavLink, useLocation } from 'react-router';
import { cx } from '../../lib/class-names';
import { Button } from '../ui/button';
import { BenchwireMark } from './benchwire-mark';

export interface AppShellNavItem {
  to: string;
  label: string;
  /** Match the path exactly (the dashboard at "/"). */
  end?: boolean;
}

export interface AppShellProps {
  user: { displayName: string; roleLabel: string };
  navigation: readonly AppShellNavItem[];
  onSignOut: () => void;
  signingOut?: boolean;
  /** A page is loading its data: shows a thin progress line under the header. */
  busy?: boolean;
  children: ReactNode;
}

/** The staff frame: header, side navigation (a menu on phones), skip link and the main landmark. */
export function AppShell({ user, navigation, onSignOut, signingOut = false, busy = false, children }: AppShellProps) {
  const navId = useId();
  const mainRef = useRef<HTMLElement>(null);
  const { pathname } = useLocation();
  const firstPath = useRef(pathname);
  // The phone menu belongs to the page it was opened on, so moving to another page closes it.
  const [menuOpenOn, setMenuOpenOn] = useState<string | null>(null);
  const menuOpen = menuOpenOn === pathname;

  // After moving to another page, start reading from its content, as a full page load would.
  useEffect(() => {
    if (pathname !== firstPath.current) {
      firstPath.current = pathname;
      mainRef.current?.focus({ preventScroll: true });
      window.scrollTo({ top: 0 });
    }
  }, [pathname]);

  return (
    <div className="min-h-dvh">
      <a
        href="#main"
        onClick={(event) => {
          event.preventDefault();
          mainRef.current?.focus();
        }}
        className="sr-only z-50 rounded-[3px] bg-ink text-paper focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:px-3 focus:py-2"
      >
        Skip to content
      </a>

      <header className="sticky top-0 z-20 border-b border-rule bg-paper/95 backdrop-blur-sm">
        <div className="flex h-13 items-center gap-2 px-3 sm:px-5">
          <button
            type="button"
            className="-ml-1 inline-flex min-h-9 items-center gap-2 rounded-[3px] px-2 text-sm font-medium hover:bg-wash md:hidden"
            aria-expanded={menuOpen}
            aria-controls={navId}
            onClick={() => setMenuOpenOn(menuOpen ? null : pathname)}
          >
            <MenuGlyph open={menuOpen} />
            Menu
          </button>
          <Link to="/" className="flex items-center gap-2 rounded-[3px] px-1 py-1 text-ink">
            <BenchwireMark className="size-5" />
            <span className="text-[1.0625rem] font-bold tracking-tight">Benchwire</span>
          </Link>

          <div className="ml-auto flex items-center gap-3">
            <p className="hidden text-right leading-tight sm:block">
              <span className="block text-sm font-medium">{user.displayName}</span>
              <span className="block text-xs text-muted">{user.roleLabel}</span>
            </p>
            <Button size="sm" onClick={onSignOut} pending={signingOut}>
              Sign out
            </Button>
          </div>
        </div>
        <div aria-hidden="true" className="h-0.5 overflow-hidden">
          {busy && (
            <div className="h-full w-1/3 animate-[benchwire-progress_1.1s_ease-in-out_infinite] bg-copper motion-reduce:w-full motion-reduce:animate-none" />
          )}
        </div>
      </header>

      <div className="md:grid md:min-h-[calc(100dvh-3.375rem)] md:grid-cols-[13.5rem_minmax(0,1fr)]">
        {/* The rule sits on this column, which is as tall as the page; the navigation inside it stays in view. */}
        <div className="md:border-r md:border-rule">
          <nav
            id={navId}
            aria-label="Main"
            className={cx(
              'border-b border-rule bg-paper md:sticky md:top-13.5 md:block md:max-h-[calc(100dvh-3.375rem)] md:overflow-y-auto md:border-b-0',
              menuOpen ? 'block' : 'hidden',
            )}
          >
            <p className="border-b border-rule px-4 py-2.5 text-sm sm:hidden">
              Signed in as <span className="font-medium">{user.displayName}</span>
              <span className="text-muted"> · {user.roleLabel}</span>
            </p>
            <ol className="px-2 py-3 md:py-5">
              {navigation.map((item, index) => (
                <li key={item.to}>
                  <NavLink
                    to={item.to}
                    end={item.end}
                    className={({ isActive }) =>
                      cx(
                        'group flex items-baseline gap-3 rounded-[3px] border-l-[3px] px-3 py-2 text-sm',
                        isActive
                          ? 'border-copper bg-surface font-semibold text-ink'
                          : 'border-transparent text-ink hover:bg-wash',
                      )
                    }
                  >
                    <span aria-hidden="true" className="numeric text-[0.6875rem] text-muted">
                      {String(index + 1).padStart(2, '0')}
                    </span>
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ol>
          </nav>
        </div>

        <main ref={mainRef} id="main" tabIndex={-1} className="min-w-0 px-4 pt-6 pb-16 outline-none sm:px-6 md:px-8">
          <div className="mx-auto max-w-6xl">{children}</div>
        </main>
      </div>
    </div>
  );
}

function MenuGlyph({ open }: { open: boolean }) {
  return (
    <svg viewBox="0 0 16 16" aria-hidden="true" className="size-4" fill="none" stroke="currentColor" strokeWidth="1.6">
      {open ? <path d="M3.5 3.5l9 9M12.5 3.5l-9 9" /> : <path d="M2 4h12M2 8h12M2 12h12" />}
    </svg>
  );
}

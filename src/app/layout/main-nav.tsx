import { useEffect, useId, useRef, useState } from 'react';
import { NavLink, useLocation, type To } from 'react-router';
import type { NavGroup } from '../navigation';

type Props = {
  groups: NavGroup[];
  /** Where a page's link goes (the shell adds the unit being looked at). */
  linkTo: (to: string) => To;
};

/**
 * The main navigation, grouped by what a shift does. Below the `lg` breakpoint (1024 px: the pages do not
 * fit one row there) it is a menu button that opens a panel with every page; from `lg` up the same groups sit
 * in one row, always shown. The panel is open only for the address it was opened at, so any navigation closes
 * it; Escape and a press outside close it too, and Escape gives the focus back to the button.
 */
export function MainNav({ groups, linkTo }: Props) {
  const location = useLocation();
  const [openAt, setOpenAt] = useState<string | null>(null);
  const open = openAt === location.key;
  const panelId = useId();
  const navRef = useRef<HTMLElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== 'Escape') return;
      setOpenAt(null);
      buttonRef.current?.focus();
    };
    const onPointer = (e: PointerEvent) => {
      if (navRef.current && !navRef.current.contains(e.target as Node)) setOpenAt(null);
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('pointerdown', onPointer);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('pointerdown', onPointer);
    };
  }, [open]);

  return (
    <nav ref={navRef} aria-label="Main" className="order-first lg:order-last lg:w-full">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpenAt(open ? null : location.key)}
        className="flex min-h-11 items-center gap-2 rounded-md border border-line px-3 font-bold focus:outline-none focus:ring-2 focus:ring-focus lg:hidden"
      >
        <span aria-hidden="true">{open ? '✕' : '☰'}</span>
        Menu
      </button>
      <div
        id={panelId}
        data-testid="main-menu"
        className={`${open ? 'block' : 'hidden'} absolute inset-x-0 top-full z-30 max-h-[calc(100dvh-4rem)] overflow-y-auto border-b border-line bg-panel px-4 pb-4 shadow-lg lg:static lg:flex lg:max-h-none lg:flex-nowrap lg:gap-x-3 lg:overflow-x-auto lg:border-0 lg:p-0 lg:shadow-none`}
      >
        {groups.map((group) => (
          <div key={group.id} role="group" aria-labelledby={`${panelId}-${group.id}`} className="pt-3 lg:shrink-0 lg:pt-0">
            <p id={`${panelId}-${group.id}`} className="px-3 text-xs font-bold tracking-wide text-muted uppercase lg:px-2">
              {group.title}
            </p>
            <ul className="grid grid-cols-1 gap-1 sm:grid-cols-2 lg:flex lg:gap-0.5">
              {group.items.map((item) => (
                <li key={item.to}>
                  <NavLink
                    to={linkTo(item.to)}
                    end={item.to === '/'}
                    className={({ isActive }) =>
                      `flex min-h-11 items-center rounded-md px-3 font-bold whitespace-nowrap focus:outline-none focus:ring-2 focus:ring-focus lg:min-h-0 lg:px-2 lg:py-1 lg:text-sm ${isActive ? 'bg-accent text-on-accent' : 'hover:bg-field'}`
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </div>
        ))}
      </div>
    </nav>
  );
}

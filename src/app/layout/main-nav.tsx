import { useEffect, useId, useRef, useState } from 'react';
import { NavLink, useLocation, type To } from 'react-router';
import type { NavGroup } from '../navigation';

type Props = {
  groups: NavGroup[];
  /** Where a page's link goes (the shell adds the unit being looked at). */
  linkTo: (to: string) => To;
};

/**
 * The main navigation, grouped by what a shift does. Below the `xl` breakpoint (1280 px: an administrator's
 * sixteen pages do not fit one row below it) it is a menu button that opens a panel with every page, the groups
 * in columns as the width allows; from `xl` up the same groups sit in one row, always shown. The panel is open only for the address it was opened at, so any navigation closes
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
    <nav ref={navRef} aria-label="Main" className="order-first xl:order-last xl:w-full">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpenAt(open ? null : location.key)}
        className="flex min-h-11 items-center gap-2 rounded-md border border-line px-3 font-bold focus:outline-none focus:ring-2 focus:ring-focus xl:hidden"
      >
        <span aria-hidden="true">{open ? '✕' : '☰'}</span>
        Menu
      </button>
      <div
        id={panelId}
        data-testid="main-menu"
        className={`${open ? 'grid' : 'hidden'} absolute inset-x-0 top-full z-30 max-h-[calc(100dvh-4rem)] gap-x-6 overflow-y-auto border-b border-line bg-panel px-4 pb-4 shadow-lg sm:grid-cols-2 md:grid-cols-3 lg:grid-cols-5 xl:static xl:flex xl:max-h-none xl:flex-nowrap xl:gap-x-3 xl:overflow-x-auto xl:border-0 xl:p-0 xl:shadow-none`}
      >
        {groups.map((group) => (
          <div key={group.id} role="group" aria-labelledby={`${panelId}-${group.id}`} className="pt-3 xl:shrink-0 xl:pt-0">
            <p id={`${panelId}-${group.id}`} className="px-3 text-xs font-bold tracking-wide text-muted uppercase xl:px-1.5">
              {group.title}
            </p>
            <ul className="flex flex-col gap-1 xl:flex-row xl:gap-0.5">
              {group.items.map((item) => (
                <li key={item.to}>
                  <NavLink
                    to={linkTo(item.to)}
                    end={item.to === '/'}
                    className={({ isActive }) =>
                      `flex min-h-11 items-center rounded-md px-3 font-bold whitespace-nowrap focus:outline-none focus:ring-2 focus:ring-focus xl:min-h-0 xl:px-1.5 xl:py-1 xl:text-sm ${isActive ? 'bg-accent text-on-accent' : 'hover:bg-field'}`
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

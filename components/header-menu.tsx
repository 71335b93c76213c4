'use client';
import { useState, type ReactNode } from 'react';

/**
 * On a phone the header is one line: the name and a Menu button that opens the links and the
 * account below it. From the sm breakpoint on, everything shows in the line and the button hides.
 */
export function HeaderMenu({ children }: { children: ReactNode }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <button
        type="button"
        className="ml-auto inline-flex min-h-target min-w-target items-center gap-2 rounded-lg border border-white/60 px-3 text-white hover:bg-moss-800 sm:hidden"
        aria-expanded={open}
        aria-controls="site-menu"
        data-testid="menu-button"
        onClick={() => setOpen(!open)}
      >
        <svg viewBox="0 0 20 20" className="h-5 w-5" aria-hidden="true">
          <path d="M3 5h14M3 10h14M3 15h14" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
        </svg>
        Menu
      </button>
      <div
        id="site-menu"
        // A link followed closes the menu.
        onClick={(e) => {
          if ((e.target as HTMLElement).closest('a')) setOpen(false);
        }}
        className={`${open ? 'flex' : 'hidden'} w-full flex-col gap-3 pb-2 sm:flex sm:w-auto sm:flex-1 sm:flex-row sm:flex-wrap sm:items-center sm:gap-x-6 sm:pb-0`}
      >
        {children}
      </div>
    </>
  );
}

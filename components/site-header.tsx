import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/session';
import { roleLabels } from '@/lib/auth/roles';
import { SignOutButton } from './sign-out-button';
import { NavLink } from './nav-link';
import { HeaderMenu } from './header-menu';

// "Ask" always starts a new question; coming back to /ask some other way offers the unfinished one.
const mainNav = [
  { href: '/species', label: 'Species' },
  { href: '/ask?start=new', label: 'Ask' },
  { href: '/answers', label: 'Answers' },
  { href: '/trees', label: 'Trees' },
  { href: '/notes', label: 'Notes' },
];

export async function SiteHeader() {
  const user = await getCurrentUser();
  const nav = user?.role === 'admin' ? [...mainNav, { href: '/admin', label: 'Admin' }] : mainNav;
  return (
    <header className="no-print border-b border-moss-800 bg-moss-700 text-white" data-testid="site-header">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2 sm:py-3">
        <Link href="/" className="inline-flex min-h-target items-center font-display text-xl font-semibold text-white no-underline" data-testid="brand">
          Candlewise
        </Link>
        <HeaderMenu>
          <nav aria-label="Main">
            <ul className="flex flex-col gap-1 sm:flex-row sm:flex-wrap" data-testid="main-nav">
              {nav.map((item) => (
                <li key={item.href}>
                  <NavLink href={item.href}>{item.label}</NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="flex flex-wrap items-center gap-3 text-sm sm:ml-auto">
            {user ? (
              <>
                <span data-testid="current-user">
                  <Link href="/profile" className="inline-flex min-h-target items-center font-medium text-white">
                    {user.name}
                  </Link>
                  <span className="ml-2 rounded bg-moss-900/60 px-2 py-0.5 text-xs" data-testid="current-role">
                    {roleLabels[user.role]}
                  </span>
                </span>
                <SignOutButton />
              </>
            ) : (
              <>
                <Link href="/sign-in" className="inline-flex min-h-target items-center font-medium text-white">
                  Sign in
                </Link>
                <Link href="/sign-up" className="inline-flex min-h-target items-center rounded-lg bg-white px-3 font-medium text-moss-800 no-underline">
                  Join
                </Link>
              </>
            )}
          </div>
        </HeaderMenu>
      </div>
    </header>
  );
}

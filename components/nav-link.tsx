'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';

export function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  const pathname = usePathname();
  const path = href.split('?')[0];
  const active = pathname === path || pathname.startsWith(`${path}/`);
  return (
    <Link
      href={href}
      aria-current={active ? 'page' : undefined}
      className={`inline-flex min-h-target items-center rounded-lg px-3 text-base text-white no-underline hover:bg-moss-800 ${active ? 'bg-moss-900 font-semibold' : ''}`}
    >
      {children}
    </Link>
  );
}

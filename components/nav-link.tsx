'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';

export function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  const pathname = usePathname();
  const active = pathname === href || pathname.startsWith(`${href}/`);
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

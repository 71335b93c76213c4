'use client';
import { useEffect, useRef, type ReactNode } from 'react';

/** A result notice that takes the focus when it appears, so keyboard and screen-reader users land on it. */
export function FocusNotice({ children, tone = 'ok' }: { children: ReactNode; tone?: 'ok' | 'error' }) {
  const ref = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    ref.current?.focus();
  }, [children]);
  return (
    <p
      ref={ref}
      tabIndex={-1}
      role="status"
      data-testid="focus-notice"
      className={`rounded-lg border p-3 ${tone === 'ok' ? 'border-moss-500 bg-moss-50 text-moss-900' : 'border-clay-500 bg-clay-100 text-clay-700'}`}
    >
      {children}
    </p>
  );
}

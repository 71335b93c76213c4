'use client';
import { useEffect } from 'react';
import { setCurrentMember, warmOfflineCopies } from './member';
import { flushQueue } from './queue';

/**
 * Mounted once in the layout. Tells the offline code who is signed in (dropping the previous
 * member's cached pages and trees when that changes), keeps the wizard's offline copies fresh, and
 * sends waiting answers whenever the connection returns.
 */
export function OfflineSync({ userId }: { userId: string | null }) {
  useEffect(() => {
    let stopped = false;
    const send = () => {
      if (userId && navigator.onLine) void flushQueue(userId).catch(() => {});
    };
    void setCurrentMember(userId).then(() => {
      if (stopped || !navigator.onLine) return;
      send();
      void warmOfflineCopies(!!userId);
    });
    window.addEventListener('online', send);
    return () => {
      stopped = true;
      window.removeEventListener('online', send);
    };
  }, [userId]);
  return null;
}

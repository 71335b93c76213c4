'use client';
import { useEffect } from 'react';
import { isOffline, probe, subscribeConnectivity } from './connectivity';
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
    let wasOffline = isOffline();
    const send = () => {
      if (userId && !isOffline()) void flushQueue(userId).catch(() => {});
    };
    const off = subscribeConnectivity(() => {
      const now = isOffline();
      if (wasOffline && !now) {
        send();
        void warmOfflineCopies(!!userId);
      }
      wasOffline = now;
    });
    void setCurrentMember(userId).then(async () => {
      // A page served from the worker's copy may think it is online: ask the server first.
      if (stopped || !(await probe()) || stopped) return;
      send();
      void warmOfflineCopies(!!userId);
    });
    return () => {
      stopped = true;
      off();
    };
  }, [userId]);
  return null;
}

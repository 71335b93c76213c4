'use client';
import { useEffect, useState } from 'react';
import { currentMemberId } from './member';
import { listQueued, sentRecord, subscribeQueue, type QueuedSave, type SentSave } from './queue';

/** The signed-in member's waiting answers, kept up to date as they are queued and sent. */
export function useQueued(): QueuedSave[] | null {
  const [items, setItems] = useState<QueuedSave[] | null>(null);
  useEffect(() => {
    let live = true;
    const load = () => {
      const userId = currentMemberId();
      if (!userId || typeof indexedDB === 'undefined') return setItems([]);
      void listQueued(userId).then(
        (l) => live && setItems(l),
        () => live && setItems([]),
      );
    };
    load();
    // The member id is set by the layout's effect, which may run after this one.
    const again = setTimeout(load, 300);
    const off = subscribeQueue(load);
    return () => {
      live = false;
      clearTimeout(again);
      off();
    };
  }, []);
  return items;
}

/** What a queued save became once sent, or null while it waits. */
export function useSent(key: string | null): SentSave | null {
  const [sent, setSent] = useState<SentSave | null>(null);
  useEffect(() => {
    if (!key) return;
    let live = true;
    const load = () => {
      const userId = currentMemberId();
      if (userId) void sentRecord(key, userId).then((r) => live && r && setSent(r));
    };
    load();
    const off = subscribeQueue(load);
    return () => {
      live = false;
      off();
    };
  }, [key]);
  return sent;
}

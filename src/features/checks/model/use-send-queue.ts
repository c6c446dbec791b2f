import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { rememberStoredCheck } from '../api/submit-check';
import { loadQueue, queueSnapshot, sendDue, subscribeQueue, wakeQueue } from './send-queue';

export const useSendQueue = () => useSyncExternalStore(subscribeQueue, queueSnapshot);

/** Runs while a mechanic is signed in: sends their waiting checks when due, and at once when the network returns. */
export function useQueueSender(kioskId: number, badge: string): void {
  const queryClient = useQueryClient();
  useEffect(() => {
    void loadQueue();
    const tick = () => sendDue({ kioskId, badge }, (stored) => rememberStoredCheck(queryClient, stored));
    const online = () => {
      wakeQueue();
      tick();
    };
    const timer = window.setInterval(tick, 1000);
    window.addEventListener('online', online);
    tick();
    return () => {
      window.clearInterval(timer);
      window.removeEventListener('online', online);
    };
  }, [kioskId, badge, queryClient]);
}

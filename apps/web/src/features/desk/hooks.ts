import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { deskQueryOptions } from './api';

/** The signed-in user's Desk; only asked for when `enabled` (someone is signed in). */
export function useDesk(enabled: boolean) {
  return useQuery({ ...deskQueryOptions(), enabled });
}

/** The current time, ticking every `everyMs` (a minute by default), for countdowns. */
export function useNow(everyMs = 60_000): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const id = setInterval(() => setNow(new Date()), everyMs);
    return () => clearInterval(id);
  }, [everyMs]);
  return now;
}

// Setups on the server: the query-key factory and the hooks over it.
import { useInfiniteQuery } from '@tanstack/react-query';
import type { SetupListResponse } from '../model/api';
import { api } from './api';

export type SetupFilter = { studio?: string; q?: string; tag?: string };

export const setupKeys = {
  all: ['setups'] as const,
  lists: () => [...setupKeys.all, 'list'] as const,
  list: (f: SetupFilter) => [...setupKeys.lists(), f] as const,
  detail: (id: string) => [...setupKeys.all, 'detail', id] as const,
};

function query(f: SetupFilter, cursor: string | null) {
  const p = new URLSearchParams();
  if (f.studio) p.set('studio', f.studio);
  if (f.q) p.set('q', f.q);
  if (f.tag) p.set('tag', f.tag);
  if (cursor) p.set('cursor', cursor);
  const s = p.toString();
  return s ? `?${s}` : '';
}

export function useSetupList(f: SetupFilter) {
  return useInfiniteQuery({
    queryKey: setupKeys.list(f),
    initialPageParam: null as string | null,
    queryFn: ({ pageParam, signal }) => api<SetupListResponse>(`/setups${query(f, pageParam)}`, { signal }),
    getNextPageParam: (last) => last.nextCursor,
  });
}

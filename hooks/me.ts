import { useQuery } from '@tanstack/react-query';
import type { Me } from '../model/api';
import { api } from './api';

export const meKeys = { all: ['me'] as const };

export function useMe() {
  return useQuery({ queryKey: meKeys.all, queryFn: ({ signal }) => api<Me>('/me', { signal }) });
}

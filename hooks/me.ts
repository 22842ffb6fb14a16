import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Me, UpdateMeBody } from '../model/api';
import { call } from './api';

export const meKeys = { all: ['me'] as const };

export function useMe() {
  return useQuery({ queryKey: meKeys.all, queryFn: ({ signal }) => call('me', { signal }) });
}

/** Change the account's settings; the cached account shows the change at once. */
export function useUpdateMe() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateMeBody) => call('updateMe', { body }),
    onMutate: (body) => {
      const before = qc.getQueryData<Me>(meKeys.all);
      if (before) qc.setQueryData<Me>(meKeys.all, { ...before, user: { ...before.user, ...body } });
      return { before };
    },
    onError: (_e, _b, ctx) => ctx?.before && qc.setQueryData(meKeys.all, ctx.before),
    onSuccess: (me) => qc.setQueryData(meKeys.all, me),
  });
}

// Share links, the shared view of a setup, and sending to the crew: query-key factory, queries, mutations.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateShareBody, SendToCrewBody, ShareLink } from '../model/api';
import { parseDocument } from '../model/document';
import { call } from './api';
import { takeSharedEarly } from './sharedEarly';

const shareKeys = {
  all: ['shares'] as const,
  list: (setupId: string) => [...shareKeys.all, 'list', setupId] as const,
  shared: (token: string) => [...shareKeys.all, 'shared', token] as const,
  membership: (token: string) => [...shareKeys.all, 'membership', token] as const,
};

/** The setup's live share links (members only; no tokens in the list). */
export function useShares(setupId: string) {
  return useQuery({ queryKey: shareKeys.list(setupId), queryFn: ({ signal }) => call('listShares', { params: { id: setupId }, signal }).then((r) => r.shares) });
}

export function useCreateShare(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShareBody) => call('createShare', { params: { id: setupId }, body }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: shareKeys.list(setupId) }),
  });
}

export function useRevokeShare(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (shareId: string) => call('revokeShare', { params: { id: setupId, shareId } }),
    onMutate: async (shareId) => {
      await qc.cancelQueries({ queryKey: shareKeys.list(setupId) });
      const before = qc.getQueryData<ShareLink[]>(shareKeys.list(setupId));
      if (before) qc.setQueryData(shareKeys.list(setupId), before.filter((s) => s.id !== shareId));
      return { before };
    },
    onError: (_e, _id, ctx) => ctx?.before && qc.setQueryData(shareKeys.list(setupId), ctx.before),
    onSettled: () => void qc.invalidateQueries({ queryKey: shareKeys.list(setupId) }),
  });
}

/** The setup behind a share link, its document parsed with the shared schema (no account needed). */
export function useSharedSetup(token: string) {
  return useQuery({
    queryKey: shareKeys.shared(token),
    queryFn: async ({ signal }) => {
      // The route's early request when there is one (hooks/sharedEarly.ts), else a request of its own.
      const s = await (takeSharedEarly(token) ?? call('sharedSetup', { params: { token }, signal }));
      return { ...s, document: parseDocument(s.document) };
    },
    refetchOnWindowFocus: true,
  });
}

/** "Send to crew": e-mails a new link (and the PDF); the new link shows up in the list. */
export function useSendToCrew(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SendToCrewBody) => call('sendToCrew', { params: { id: setupId }, body }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: shareKeys.list(setupId) }),
  });
}

/** Whether the visitor of a share link is signed in and a member of its studio (then: comments). Quietly null otherwise. */
export function useShareMembership(token: string) {
  return useQuery({
    queryKey: shareKeys.membership(token),
    queryFn: ({ signal }) => call('sharedMembership', { params: { token }, signal }).catch(() => null),
    retry: false,
  });
}

// Studios, members and invitations on the server: the query-key factory, queries, and mutations that update
// the cache at once and invalidate what they touched.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InviteMemberBody, StudioInvitation, StudioMember, StudioRole, StudioView } from '../model/api';
import { call } from './api';
import { meKeys } from './me';
import { setupKeys } from './setups';

const studioKeys = {
  all: ['studios'] as const,
  list: () => [...studioKeys.all, 'list'] as const,
  detail: (id: string) => [...studioKeys.all, 'detail', id] as const,
  members: (id: string) => [...studioKeys.all, 'members', id] as const,
  invitations: (id: string) => [...studioKeys.all, 'invitations', id] as const,
};
const invitationKeys = {
  all: ['invitations'] as const,
  carried: () => [...invitationKeys.all, 'carried'] as const,
  preview: (token: string) => [...invitationKeys.all, 'preview', token] as const,
};

export function useStudios() {
  return useQuery({ queryKey: studioKeys.list(), queryFn: ({ signal }) => call('listStudios', { signal }).then((r) => r.studios) });
}

export function useStudio(id: string) {
  return useQuery({ queryKey: studioKeys.detail(id), queryFn: ({ signal }) => call('getStudio', { params: { id }, signal }) });
}

export function useCreateStudio() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => call('createStudio', { body }),
    onSuccess: (s) => {
      qc.setQueryData<StudioView[]>(studioKeys.list(), (old) => (old ? [...old, s] : old));
      void qc.invalidateQueries({ queryKey: studioKeys.list() });
      void qc.invalidateQueries({ queryKey: meKeys.all });
    },
  });
}

export function useMembers(studioId: string) {
  return useQuery({
    queryKey: studioKeys.members(studioId),
    queryFn: ({ signal }) => call('studioMembers', { params: { id: studioId }, signal }).then((r) => r.members),
  });
}

export function useInvitations(studioId: string, enabled = true) {
  return useQuery({
    queryKey: studioKeys.invitations(studioId),
    queryFn: ({ signal }) => call('studioInvitations', { params: { id: studioId }, signal }).then((r) => r.invitations),
    enabled,
  });
}

/** Invite by e-mail; the answer holds the link to hand over (until a mailer sends it). */
export function useInvite(studioId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteMemberBody) => call('inviteMember', { params: { id: studioId }, body }),
    onSuccess: (r) => {
      qc.setQueryData<StudioInvitation[]>(studioKeys.invitations(studioId), (old) => [r.invitation, ...(old ?? []).filter((i) => i.email !== r.invitation.email)]);
      void qc.invalidateQueries({ queryKey: studioKeys.invitations(studioId) });
    },
  });
}

export function useRevokeInvitation(studioId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => call('cancelStudioInvitation', { params: { id: studioId, invitationId } }),
    onMutate: async (invitationId) => {
      await qc.cancelQueries({ queryKey: studioKeys.invitations(studioId) });
      const before = qc.getQueryData<StudioInvitation[]>(studioKeys.invitations(studioId));
      qc.setQueryData<StudioInvitation[]>(studioKeys.invitations(studioId), (old) => old?.filter((i) => i.id !== invitationId));
      return { before };
    },
    onError: (_e, _id, ctx) => qc.setQueryData(studioKeys.invitations(studioId), ctx?.before),
    onSettled: () => void qc.invalidateQueries({ queryKey: studioKeys.invitations(studioId) }),
  });
}

/** Change a member's role (role) or remove them (role null); shown at once, put back if refused. */
export function useChangeMember(studioId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ userId, role }: { userId: string; role: StudioRole | null }) => {
      if (role) await call('changeMemberRole', { params: { id: studioId, userId }, body: { role } });
      else await call('removeMember', { params: { id: studioId, userId } });
    },
    onMutate: async ({ userId, role }) => {
      await qc.cancelQueries({ queryKey: studioKeys.members(studioId) });
      const before = qc.getQueryData<StudioMember[]>(studioKeys.members(studioId));
      qc.setQueryData<StudioMember[]>(studioKeys.members(studioId), (old) =>
        role ? old?.map((m) => (m.userId === userId ? { ...m, role } : m)) : old?.filter((m) => m.userId !== userId),
      );
      return { before };
    },
    onError: (_e, _v, ctx) => qc.setQueryData(studioKeys.members(studioId), ctx?.before),
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: studioKeys.members(studioId) });
      void qc.invalidateQueries({ queryKey: studioKeys.list() });
      void qc.invalidateQueries({ queryKey: meKeys.all });
    },
  });
}

/** The invitation this browser brought from a link opened before signing in, if still open. */
export function useCarriedInvitation() {
  return useQuery({
    queryKey: invitationKeys.carried(),
    queryFn: ({ signal }) => call('myInvitation', { signal }).then((r) => r.invitation ?? null),
    staleTime: 5 * 60_000,
  });
}

export function useInvitationPreview(token: string) {
  return useQuery({ queryKey: invitationKeys.preview(token), queryFn: ({ signal }) => call('invitationPreview', { params: { token }, signal }) });
}

export function useAcceptInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => call('acceptInvitation', { params: { token } }),
    onSuccess: () => {
      qc.setQueryData(invitationKeys.carried(), null);
      void qc.invalidateQueries({ queryKey: invitationKeys.all });
      void qc.invalidateQueries({ queryKey: meKeys.all });
      void qc.invalidateQueries({ queryKey: studioKeys.all });
      void qc.invalidateQueries({ queryKey: setupKeys.lists() });
    },
  });
}

/** "Not now": forget the invitation this browser carries (the link itself keeps working). */
export function useForgetInvitation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => call('dismissInvitation'),
    onMutate: () => qc.setQueryData(invitationKeys.carried(), null),
  });
}

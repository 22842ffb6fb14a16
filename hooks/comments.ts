// A setup's comments on the server: the thread query, adding a comment or reply (shown at once), resolving a
// thread, and marking them read (which clears the library's unread count).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CommentBody, CommentsResponse, SetupComment } from '../model/api';
import { call } from './api';
import { setupKeys } from './setups';

const commentKeys = { thread: (setupId: string) => setupKeys.comments(setupId) };

export function useComments(setupId: string, o: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: commentKeys.thread(setupId),
    queryFn: ({ signal }) => call('listComments', { params: { id: setupId }, signal }),
    enabled: o.enabled ?? true,
    // Crew and photographer talk across devices: look again now and then while the thread is open.
    refetchInterval: 30_000,
  });
}

export function useAddComment(setupId: string, me: { id: string; name: string }) {
  const qc = useQueryClient();
  const key = commentKeys.thread(setupId);
  return useMutation({
    mutationFn: (body: CommentBody) => call('addComment', { params: { id: setupId }, body }),
    onMutate: async (body) => {
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<CommentsResponse>(key);
      const draft: SetupComment = {
        id: `draft-${Date.now()}`,
        body: body.body,
        itemId: body.itemId ?? null,
        point: body.point ?? null,
        parentId: body.parentId ?? null,
        resolvedAt: null,
        resolvedBy: null,
        createdAt: new Date().toISOString(),
        author: me,
      };
      if (before) qc.setQueryData<CommentsResponse>(key, { ...before, comments: [...before.comments, draft] });
      return { before };
    },
    onError: (_e, _b, ctx) => ctx?.before && qc.setQueryData(key, ctx.before),
    onSettled: () => void qc.invalidateQueries({ queryKey: key }),
  });
}

export function useResolveComment(setupId: string) {
  const qc = useQueryClient();
  const key = commentKeys.thread(setupId);
  return useMutation({
    mutationFn: (v: { id: string; resolved: boolean }) => call('resolveComment', { params: { id: setupId, commentId: v.id }, body: { resolved: v.resolved } }),
    onSuccess: (c) => {
      const before = qc.getQueryData<CommentsResponse>(key);
      if (before) qc.setQueryData<CommentsResponse>(key, { ...before, comments: before.comments.map((x) => (x.id === c.id ? c : x)) });
    },
    onSettled: () => void qc.invalidateQueries({ queryKey: key }),
  });
}

/** Mark the thread read; the library's unread counts follow. */
export function useMarkCommentsRead(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => call('markCommentsRead', { params: { id: setupId } }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: setupKeys.lists() }),
  });
}

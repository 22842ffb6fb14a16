// Setups on the server: the query-key factory, the query hooks, and mutations that update the cache at once
// (optimistically) and invalidate what they touched. Lists are invalidated, never a setup's detail while the
// editor holds it (that would fight the user's edits).
import { useInfiniteQuery, useMutation, useQuery, useQueryClient, type InfiniteData, type QueryClient } from '@tanstack/react-query';
import type { CreateSetupBody, DuplicateSetupBody, SetupDetail, SetupListResponse, SetupSort, UpdateSetupBody } from '../model/api';
import { ApiRequestError, call, type CallArgs } from './api';

export type LibrarySection = 'library' | 'templates' | 'deleted';
export type SetupFilter = { studio?: string; q?: string; tag?: string; sort?: SetupSort; section?: LibrarySection };

export const setupKeys = {
  all: ['setups'] as const,
  lists: () => [...setupKeys.all, 'list'] as const,
  list: (f: SetupFilter) => [...setupKeys.lists(), f] as const,
  detail: (id: string) => [...setupKeys.all, 'detail', id] as const,
  history: (id: string) => [...setupKeys.all, 'history', id] as const,
  comments: (id: string) => [...setupKeys.all, 'comments', id] as const,
  tags: (studio?: string) => [...setupKeys.all, 'tags', studio ?? 'all'] as const,
};

/** The library list's query: only what differs from the server's defaults. */
export function listQuery(f: SetupFilter, cursor: string | null): CallArgs<'listSetups'>['query'] {
  return {
    studio: f.studio || undefined,
    q: f.q || undefined,
    tag: f.tag || undefined,
    sort: f.sort && f.sort !== 'updated' ? f.sort : undefined,
    templates: f.section === 'templates' ? 1 : undefined,
    deleted: f.section === 'deleted' ? 1 : undefined,
    cursor: cursor ?? undefined,
  };
}

/** One section of the library, page by page (infinite scroll). */
export function useSetupList(f: SetupFilter) {
  return useInfiniteQuery({
    queryKey: setupKeys.list(f),
    initialPageParam: null as string | null,
    queryFn: ({ pageParam, signal }) => call('listSetups', { query: listQuery(f, pageParam), signal }),
    getNextPageParam: (last) => last.nextCursor,
  });
}

export function useTags(studio?: string) {
  return useQuery({
    queryKey: setupKeys.tags(studio),
    queryFn: ({ signal }) => call('listTags', { query: { studio }, signal }).then((r) => r.tags ?? []),
  });
}

/** The document model's parser, loaded with the plan screens (components/shareScreen.ts): the library and the
 *  sign-in page never download the setup document's schema or the meter it brings. */
export const documentParser = () =>
  import('../components/shareScreen')
    .then((m) => m.shareModules())
    .then((m) => m.parseDocument);

/** Read a setup, its document parsed (and migrated) with the shared schema. The editor owns it once open. */
export function useSetup(id: string) {
  return useQuery({
    queryKey: setupKeys.detail(id),
    queryFn: async ({ signal }) => {
      const [s, parseDocument] = await Promise.all([call('getSetup', { params: { id }, signal }), documentParser()]);
      return { ...s, document: parseDocument(s.document) };
    },
    staleTime: Infinity,
    refetchOnWindowFocus: false,
    // The open editor owns the document; autosave writes this cache on every save and must not re-render it.
    notifyOnChangeProps: ['status', 'error'],
  });
}

/** The stored copy the server sent with a 409, or null for any other error. */
export function conflictOf(err: unknown): SetupDetail | null {
  if (!(err instanceof ApiRequestError) || err.status !== 409) return null;
  return (err.body as { error?: { current?: SetupDetail } } | null)?.error?.current ?? null;
}

/**
 * Save `{ version, ...changes }`. The detail cache shows the changes at once; a 409 is thrown as an
 * ApiRequestError whose `body.error.current` is the server's copy (see conflictOf) and leaves the user's
 * changes in the cache for the editor to resolve; any other failure puts the cache back.
 */
export function useSaveSetup(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateSetupBody) => call('updateSetup', { params: { id }, body }),
    onMutate: async ({ version: _v, ...changes }) => {
      await qc.cancelQueries({ queryKey: setupKeys.detail(id) });
      const before = qc.getQueryData<SetupDetail>(setupKeys.detail(id));
      if (before) qc.setQueryData<SetupDetail>(setupKeys.detail(id), { ...before, ...changes });
      return { before };
    },
    onError: (err, _body, ctx) => {
      if (!conflictOf(err) && ctx?.before) qc.setQueryData(setupKeys.detail(id), ctx.before);
    },
    onSuccess: (saved) => {
      qc.setQueryData<SetupDetail>(setupKeys.detail(id), (old) => (old ? { ...old, ...saved } : old));
      void qc.invalidateQueries({ queryKey: setupKeys.lists() });
      void qc.invalidateQueries({ queryKey: setupKeys.history(id) });
    },
  });
}

function listsChanged(qc: QueryClient) {
  void qc.invalidateQueries({ queryKey: setupKeys.lists() });
  void qc.invalidateQueries({ queryKey: [...setupKeys.all, 'tags'] });
}

/** Take a setup out of every cached list page at once (delete, restore); returns how to put them back. */
function removeFromLists(qc: QueryClient, id: string) {
  const snapshot = qc.getQueriesData<InfiniteData<SetupListResponse>>({ queryKey: setupKeys.lists() });
  qc.setQueriesData<InfiniteData<SetupListResponse>>({ queryKey: setupKeys.lists() }, (data) =>
    data ? { ...data, pages: data.pages.map((p) => ({ ...p, setups: p.setups.filter((s) => s.id !== id) })) } : data,
  );
  return () => snapshot.forEach(([key, data]) => qc.setQueryData(key, data));
}

export function useCreateSetup() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSetupBody) => call('createSetup', { body }),
    // Awaited before the caller goes on (to the editor, which this also starts loading).
    onSuccess: async (s) => {
      const parseDocument = await documentParser();
      qc.setQueryData(setupKeys.detail(s.id), { ...s, document: parseDocument(s.document) });
      listsChanged(qc);
    },
  });
}

export function useDuplicateSetup() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: DuplicateSetupBody & { id: string }) => call('duplicateSetup', { params: { id }, body }),
    onSuccess: async (s) => {
      const parseDocument = await documentParser();
      qc.setQueryData(setupKeys.detail(s.id), { ...s, document: parseDocument(s.document) });
      listsChanged(qc);
    },
  });
}

export function useDeleteSetup() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => call('deleteSetup', { params: { id } }),
    onMutate: async (id) => {
      await qc.cancelQueries({ queryKey: setupKeys.lists() });
      return { putBack: removeFromLists(qc, id) };
    },
    onError: (_e, _id, ctx) => ctx?.putBack(),
    onSettled: (_d, _e, id) => {
      qc.removeQueries({ queryKey: setupKeys.detail(id) });
      listsChanged(qc);
    },
  });
}

export function useRestoreSetup() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => call('restoreSetup', { params: { id } }),
    onMutate: async (id) => {
      await qc.cancelQueries({ queryKey: setupKeys.lists() });
      return { putBack: removeFromLists(qc, id) };
    },
    onError: (_e, _id, ctx) => ctx?.putBack(),
    onSettled: () => listsChanged(qc),
  });
}

export function useSetupHistory(id: string) {
  return useInfiniteQuery({
    queryKey: setupKeys.history(id),
    initialPageParam: null as number | null,
    queryFn: ({ pageParam, signal }) => call('setupHistory', { params: { id }, query: { before: pageParam ?? undefined }, signal }),
    getNextPageParam: (last) => last.nextBefore,
  });
}

/** Make an earlier version current again (as a new version); the editor's copy is replaced by it. */
export function useRestoreVersion(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ versionId, version }: { versionId: string; version?: number }) =>
      call('restoreVersion', { params: { id, versionId }, body: version ? { version } : {} }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: setupKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: setupKeys.history(id) });
      listsChanged(qc);
    },
  });
}

// Comments: hooks/comments.ts.

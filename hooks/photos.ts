// Photos attached to a setup: query-key factory, the list, upload (multipart) and delete.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PhotoKind, SetupPhoto } from '../model/api';
import { call } from './api';

const photoKeys = {
  all: ['photos'] as const,
  list: (setupId: string) => [...photoKeys.all, 'list', setupId] as const,
};

export function usePhotos(setupId: string) {
  return useQuery({ queryKey: photoKeys.list(setupId), queryFn: ({ signal }) => call('listPhotos', { params: { id: setupId }, signal }).then((r) => r.photos) });
}

/** What to upload: a web File/Blob, or a native file by its uri. */
export type PhotoFile = { blob: Blob; name: string } | { uri: string; name: string; type: string };

export function useUploadPhoto(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, kind }: { file: PhotoFile; kind: PhotoKind }) => {
      const form = new FormData();
      form.append('kind', kind);
      // React Native's FormData takes { uri, name, type } for a file on the device.
      if ('blob' in file) form.append('photo', file.blob, file.name);
      else form.append('photo', file as unknown as Blob);
      return call('uploadPhoto', { params: { id: setupId }, body: form });
    },
    onSuccess: (photo) => {
      qc.setQueryData<SetupPhoto[]>(photoKeys.list(setupId), (old) => [photo, ...(old ?? []).filter((p) => p.id !== photo.id)]);
      void qc.invalidateQueries({ queryKey: photoKeys.list(setupId) });
    },
  });
}

export function useDeletePhoto(setupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => call('deletePhoto', { params: { id: setupId, photoId } }),
    onMutate: async (photoId) => {
      await qc.cancelQueries({ queryKey: photoKeys.list(setupId) });
      const before = qc.getQueryData<SetupPhoto[]>(photoKeys.list(setupId));
      if (before) qc.setQueryData(photoKeys.list(setupId), before.filter((p) => p.id !== photoId));
      return { before };
    },
    onError: (_e, _id, ctx) => ctx?.before && qc.setQueryData(photoKeys.list(setupId), ctx.before),
    onSettled: () => void qc.invalidateQueries({ queryKey: photoKeys.list(setupId) }),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { i18n } from '@/i18n';
import { ApiRequestError, getCsrfToken, api } from '@/lib/api-client';
import { logKeys } from './keys';

export interface Photo {
  id: string;
  observationId: string;
  contentType: string;
  bytes: number;
  url: string;
  createdAt: string;
}

export const getPhotos = (observationId: string) => api.get<Photo[]>(`/api/observations/${observationId}/photos`);

export const photosQueryOptions = (trialId: string, observationId: string) =>
  queryOptions({ queryKey: logKeys.photos(trialId, observationId), queryFn: () => getPhotos(observationId) });

export function usePhotos(trialId: string, observationId: string) {
  return useQuery(photosQueryOptions(trialId, observationId));
}

/** Uploads one image as multipart form data; the server checks what the file really is. */
export function useUploadPhoto(trialId: string, observationId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (file: File) => {
      const form = new FormData();
      form.append('photo', file);
      const res = await fetch(`/api/observations/${observationId}/photos`, { method: 'POST', body: form, credentials: 'same-origin', headers: { 'X-CSRF-Token': getCsrfToken() ?? '' } });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new ApiRequestError(res.status, body?.error?.code ?? 'http_error', body?.error?.message ?? i18n.getFixedT(null, 'logs')(($) => $.photoFailed));
      return body.data as Photo;
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: logKeys.photos(trialId, observationId) }),
  });
}

export function useDeletePhoto(trialId: string, observationId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => api.delete<void>(`/api/photos/${photoId}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: logKeys.photos(trialId, observationId) }),
  });
}

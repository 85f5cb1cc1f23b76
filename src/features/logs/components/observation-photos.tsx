import { useRef } from 'react';
import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { useDeletePhoto, usePhotos, useUploadPhoto } from '../api/photos';

/** Photos of one observation: thumbnails, and for the owner an upload button (JPEG, PNG or WebP, up to 8 MB). */
export function ObservationPhotos({ trialId, observationId, editable }: { trialId: string; observationId: string; editable: boolean }) {
  const { t } = useTranslation('logs');
  const { t: tc } = useTranslation('common');
  const photos = usePhotos(trialId, observationId);
  const upload = useUploadPhoto(trialId, observationId);
  const remove = useDeletePhoto(trialId, observationId);
  const input = useRef<HTMLInputElement>(null);
  return (
    <div className="space-y-2">
      {photos.data?.length ? (
        <ul className="flex flex-wrap gap-2">
          {photos.data.map((p) => (
            <li key={p.id} className="relative">
              <a href={p.url} target="_blank" rel="noreferrer">
                <img src={p.url} alt={t(($) => $.photos.alt)} className="h-20 w-20 rounded-lg object-cover" loading="lazy" />
              </a>
              {editable ? (
                <Button variant="ghost" size="sm" onClick={() => remove.mutate(p.id)} aria-label={t(($) => $.photos.delete)}>
                  {tc(($) => $.actions.delete)}
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {editable ? (
        <>
          <input
            ref={input}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            className="sr-only"
            aria-label={t(($) => $.photos.add)}
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) upload.mutate(file, { onSettled: () => input.current && (input.current.value = '') });
            }}
          />
          <Button variant="secondary" size="sm" onClick={() => input.current?.click()} disabled={upload.isPending}>
            {upload.isPending ? t(($) => $.photos.uploading) : t(($) => $.photos.add)}
          </Button>
        </>
      ) : null}
      {upload.isError ? <Alert tone="error">{upload.error.message}</Alert> : null}
    </div>
  );
}

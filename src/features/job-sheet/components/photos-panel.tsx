import { useEffect, useState } from 'react';
import { PHOTO_STAGES, type JobPhoto, type PhotoStage, type SheetSpace } from '../../../../shared/api/job-sheet';
import type { PendingPhoto } from '../merge-pending';

const MAX_BYTES = 15 * 1024 * 1024;
const STAGE_LABEL: Record<PhotoStage, string> = { before: 'Before', during: 'During', after: 'After' };

/** A photo not sent yet, shown from IndexedDB. A data: URL, since the app's CSP allows data: images but not blob:. */
function PendingThumb({ photo }: { photo: PendingPhoto }) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    const reader = new FileReader();
    reader.onload = () => setUrl(typeof reader.result === 'string' ? reader.result : null);
    reader.readAsDataURL(photo.file);
    return () => reader.abort();
  }, [photo.file]);
  return (
    <figure className="relative">
      {url ? (
        <img src={url} alt={photo.caption || `${STAGE_LABEL[photo.stage]} photo`} className="h-24 w-full rounded object-cover opacity-80" />
      ) : (
        <div className="h-24 w-full rounded bg-paper-dark" aria-hidden />
      )}
      <figcaption className={`text-sm font-semibold ${photo.failed ? 'text-brick-dark' : 'text-straw-dark'}`}>
        {photo.failed ? 'Refused' : 'Waiting to send'}
      </figcaption>
    </figure>
  );
}

/** Before, during and after photos of one space, from the camera or files; queued when offline. */
export function PhotosPanel({
  space,
  photos,
  pending,
  onAdd,
  disabled,
}: {
  space: SheetSpace;
  photos: JobPhoto[];
  pending: PendingPhoto[];
  onAdd: (file: File, stage: PhotoStage, caption: string) => void;
  disabled?: boolean;
}) {
  const [stage, setStage] = useState<PhotoStage>('before');
  const [caption, setCaption] = useState('');
  const [error, setError] = useState<string | null>(null);
  const inputId = `photo-${space.id}`;
  return (
    <div>
      {PHOTO_STAGES.map((s) => {
        const saved = photos.filter((p) => p.spaceId === space.id && p.stage === s);
        const waiting = pending.filter((p) => p.spaceId === space.id && p.stage === s);
        return (
          <div key={s} className="mb-3">
            <h5 className="text-base font-bold">
              {STAGE_LABEL[s]} <span className="font-normal text-graphite-light">({saved.length + waiting.length})</span>
            </h5>
            {saved.length + waiting.length > 0 && (
              <div className="mt-1 grid grid-cols-3 gap-2">
                {saved.map((p) => (
                  <figure key={p.id}>
                    <img src={p.thumbUrl} alt={p.caption || `${STAGE_LABEL[s]} photo`} className="h-24 w-full rounded object-cover" loading="lazy" />
                    {p.caption && <figcaption className="truncate text-sm">{p.caption}</figcaption>}
                  </figure>
                ))}
                {waiting.map((p) => (
                  <PendingThumb key={p.key} photo={p} />
                ))}
              </div>
            )}
          </div>
        );
      })}
      {!disabled && (
        <div className="rounded-md border-2 border-dashed border-graphite/40 bg-white/70 p-3">
          <div role="radiogroup" aria-label="Photo stage" className="grid grid-cols-3 gap-1">
            {PHOTO_STAGES.map((s) => (
              <button
                key={s}
                type="button"
                role="radio"
                aria-checked={stage === s}
                onClick={() => setStage(s)}
                className={`min-h-11 rounded-md border-2 text-base font-bold ${stage === s ? 'border-graphite bg-graphite text-white' : 'border-graphite/40 bg-white'}`}
              >
                {STAGE_LABEL[s]}
              </button>
            ))}
          </div>
          <label className="mt-2 block text-base font-semibold" htmlFor={`${inputId}-caption`}>
            Caption (optional)
          </label>
          <input
            id={`${inputId}-caption`}
            value={caption}
            onChange={(e) => setCaption(e.target.value)}
            maxLength={500}
            className="mt-1 h-11 w-full rounded-md border-2 border-graphite/40 px-2 text-lg"
          />
          <label
            htmlFor={inputId}
            className="mt-2 flex min-h-12 cursor-pointer items-center justify-center rounded-md bg-teal-dark px-4 text-lg font-bold text-white"
          >
            Take or choose a {STAGE_LABEL[stage].toLowerCase()} photo
          </label>
          <input
            id={inputId}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            capture="environment"
            className="sr-only"
            onChange={(e) => {
              const file = e.target.files?.[0];
              e.target.value = '';
              if (!file) return;
              if (file.size > MAX_BYTES) return setError('That photo is larger than 15 MB. Take it at a lower resolution or pick a smaller file.');
              setError(null);
              onAdd(file, stage, caption.trim());
              setCaption('');
            }}
          />
          {error && (
            <p role="alert" className="mt-2 text-base font-semibold text-brick-dark">
              {error}
            </p>
          )}
        </div>
      )}
    </div>
  );
}

import { useEffect, useRef, useState, type PointerEvent } from 'react';
import type { PhotoDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatDateTime, formatNumber } from '@/lib/format';
import { useDeletePhoto } from '../api/delete-photo';
import { useUpdatePhoto } from '../api/update-photo';

const SOURCE_WORDS = { exif: 'from the photo', device: 'recorded by the form' } as const;

function altOf(photo: PhotoDto, index: number, holeNumber: string): string {
  return photo.caption?.trim() || `Photo ${index + 1} of test hole ${holeNumber} (no caption)`;
}

/**
 * Thumbnails of a hole's photos; one opens a full-size viewer (a modal dialog) that pages with
 * the arrow keys, the buttons or a swipe, and closes with Escape. Captions are the alt text.
 */
export function PhotoGallery({
  photos,
  projectId,
  holeId,
  holeNumber,
  canChange,
}: {
  photos: PhotoDto[];
  projectId: number;
  holeId: number;
  holeNumber: string;
  canChange: (photo: PhotoDto) => boolean;
}) {
  const [open, setOpen] = useState<number | null>(null);
  return (
    <>
      <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4 lg:grid-cols-6" aria-label={`Photos of test hole ${holeNumber}`}>
        {photos.map((p, i) => (
          <li key={p.id}>
            <button
              type="button"
              onClick={() => setOpen(i)}
              className="group block w-full overflow-hidden rounded-md border border-ink-200 bg-ink-100 text-left focus-visible:outline-2 focus-visible:outline-brand-500"
              aria-label={`Open photo ${i + 1} of ${photos.length}: ${altOf(p, i, holeNumber)}`}
            >
              {p.state === 'ready' ? (
                <img src={p.thumbnailUrl} alt={altOf(p, i, holeNumber)} loading="lazy" className="aspect-square w-full object-cover transition-transform group-hover:scale-105" />
              ) : (
                <span role="img" aria-label={altOf(p, i, holeNumber)} className="flex aspect-square w-full items-center justify-center p-2 text-center text-xs text-ink-600">
                  {p.state === 'processing' ? 'Preparing…' : 'No preview (file kept as uploaded)'}
                </span>
              )}
              {p.caption && <span className="block truncate bg-white px-1.5 py-1 text-xs text-ink-700">{p.caption}</span>}
            </button>
          </li>
        ))}
      </ul>
      {open != null && photos[open] && (
        <PhotoViewer
          photos={photos}
          index={open}
          onIndex={setOpen}
          onClose={() => setOpen(null)}
          projectId={projectId}
          holeId={holeId}
          holeNumber={holeNumber}
          canEdit={canChange(photos[open])}
        />
      )}
    </>
  );
}

function PhotoViewer({
  photos,
  index,
  onIndex,
  onClose,
  projectId,
  holeId,
  holeNumber,
  canEdit,
}: {
  photos: PhotoDto[];
  index: number;
  onIndex: (i: number) => void;
  onClose: () => void;
  projectId: number;
  holeId: number;
  holeNumber: string;
  canEdit: boolean;
}) {
  const dialog = useRef<HTMLDialogElement>(null);
  const swipe = useRef<{ x: number; y: number } | null>(null);
  const photo = photos[index]!;
  const [caption, setCaption] = useState(photo.caption ?? '');
  const update = useUpdatePhoto(projectId, holeId);
  const remove = useDeletePhoto(projectId, holeId);
  const [confirmDelete, setConfirmDelete] = useState(false);

  useEffect(() => {
    const d = dialog.current;
    if (d && !d.open) d.showModal();
  }, []);

  useEffect(() => {
    setCaption(photo.caption ?? '');
    setConfirmDelete(false);
    update.reset();
    remove.reset();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [photo.id]);

  const prev = () => onIndex((index - 1 + photos.length) % photos.length);
  const next = () => onIndex((index + 1) % photos.length);

  const onPointerDown = (e: PointerEvent) => {
    swipe.current = { x: e.clientX, y: e.clientY };
  };
  const onPointerUp = (e: PointerEvent) => {
    const start = swipe.current;
    swipe.current = null;
    if (!start || photos.length < 2) return;
    const dx = e.clientX - start.x;
    const dy = e.clientY - start.y;
    if (Math.abs(dx) > 50 && Math.abs(dx) > 1.5 * Math.abs(dy)) (dx < 0 ? next : prev)();
  };

  return (
    <dialog
      ref={dialog}
      aria-label={`Photo ${index + 1} of ${photos.length}, test hole ${holeNumber}`}
      onClose={onClose}
      onCancel={onClose}
      onKeyDown={(e) => {
        if ((e.target as HTMLElement).tagName === 'INPUT') return;
        if (e.key === 'ArrowLeft') prev();
        else if (e.key === 'ArrowRight') next();
      }}
      className="m-0 h-dvh max-h-none w-screen max-w-none bg-ink-900 p-0 text-white backdrop:bg-ink-900/90 sm:m-auto sm:h-[92vh] sm:w-[92vw] sm:rounded-lg"
    >
      <div className="flex h-full flex-col">
        <div className="flex items-center justify-between gap-2 px-3 py-2">
          <p className="text-sm">
            {index + 1} / {photos.length} · {holeNumber}
          </p>
          <Button variant="inverse" onClick={() => dialog.current?.close()} autoFocus>
            Close
          </Button>
        </div>
        <div className="relative flex min-h-0 flex-1 touch-pan-y items-center justify-center select-none" onPointerDown={onPointerDown} onPointerUp={onPointerUp}>
          {photo.state === 'processing' ? (
            <p className="text-sm text-white/80">The photo is being prepared; it appears here in a moment.</p>
          ) : (
            <img src={photo.url} alt={altOf(photo, index, holeNumber)} className="max-h-full max-w-full object-contain" draggable={false} />
          )}
          {photos.length > 1 && (
            <>
              <button type="button" onClick={prev} aria-label="Previous photo" className="absolute top-1/2 left-2 flex size-12 -translate-y-1/2 items-center justify-center rounded-full bg-black/50 text-2xl">
                ‹
              </button>
              <button type="button" onClick={next} aria-label="Next photo" className="absolute top-1/2 right-2 flex size-12 -translate-y-1/2 items-center justify-center rounded-full bg-black/50 text-2xl">
                ›
              </button>
            </>
          )}
        </div>
        <div className="space-y-2 px-3 py-3 text-sm">
          <p className="font-medium">{photo.caption || <span className="text-white/60">No caption</span>}</p>
          <p className="text-xs text-white/70">
            Taken {formatDateTime(photo.takenAt)}
            {photo.takenAtSource && ` (${SOURCE_WORDS[photo.takenAtSource]})`}
            {photo.gpsLat != null &&
              photo.gpsLon != null &&
              ` · at ${formatNumber(photo.gpsLat, 6)}, ${formatNumber(photo.gpsLon, 6)} (WGS 84${photo.gpsSource ? `, ${SOURCE_WORDS[photo.gpsSource]}` : ''}${
                photo.gpsAccuracyMetres != null ? `, ±${formatNumber(photo.gpsAccuracyMetres, 0)} m` : ''
              })`}{' '}
            · {photo.width} × {photo.height} px · uploaded {formatDateTime(photo.createdAt)} ·{' '}
            <a href={photo.originalUrl} className="underline underline-offset-2" download>
              original file
            </a>
          </p>
          {canEdit && (
            <form
              className="flex flex-wrap items-end gap-2"
              onSubmit={(e) => {
                e.preventDefault();
                update.mutate({ photoId: photo.id, caption: caption.trim() || null });
              }}
            >
              <label className="flex min-w-0 flex-1 basis-full flex-col gap-1 text-xs sm:basis-auto">
                Caption
                <input value={caption} maxLength={300} onChange={(e) => setCaption(e.target.value)} className="min-h-11 rounded-md border border-white/30 bg-white/10 px-3 text-base text-white sm:text-sm" />
              </label>
              <Button type="submit" variant="inverse" busy={update.isPending} disabled={(photo.caption ?? '') === caption.trim()}>
                Save caption
              </Button>
              {confirmDelete ? (
                <Button
                  variant="danger"
                  busy={remove.isPending}
                  onClick={() =>
                    remove.mutate(photo.id, {
                      onSuccess: () => {
                        if (photos.length <= 1) dialog.current?.close();
                        else onIndex(Math.min(index, photos.length - 2));
                      },
                    })
                  }
                >
                  Delete for good
                </Button>
              ) : (
                <Button variant="inverse" onClick={() => setConfirmDelete(true)}>
                  Delete photo
                </Button>
              )}
            </form>
          )}
          {update.isSuccess && <p className="text-xs text-ok-100">Caption saved.</p>}
          {(update.error || remove.error) && <ProblemAlert error={update.error ?? remove.error} />}
        </div>
      </div>
    </dialog>
  );
}

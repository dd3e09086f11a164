import { useEffect, useId, useRef, useState, type DragEvent } from 'react';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { formatDateTime, formatNumber } from '@/lib/format';
import { useUploadPhotos, type UploadProgress } from '../api/upload-photos';
import { quickPosition } from '../hooks/use-gps-fix';
import { newClientId } from '../utils/client-id';

interface Staged {
  file: File;
  url: string;
  /** Made when the photo was picked; sent with it so a retried upload keeps one copy. */
  clientId: string;
}

/** The server takes at most this many photos per upload. */
const MAX_PER_UPLOAD = 10;

function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${formatNumber(bytes / (1024 * 1024), 1)} MB` : `${formatNumber(Math.max(1, bytes / 1024), 0)} kB`;
}

/**
 * Add photos to a hole: the phone camera (capture) or files, drag-and-drop on desktops, several
 * at once. The form records the time and its own GPS fix when the photos are chosen, because
 * phone browsers strip both from uploads; a progress bar follows the upload.
 */
export function PhotoUpload({ projectId, holeId, holeNumber }: { projectId: number; holeId: number; holeNumber: string }) {
  const upload = useUploadPhotos(projectId, holeId);
  const [staged, setStaged] = useState<Staged[]>([]);
  const [refused, setRefused] = useState<string[]>([]);
  const [caption, setCaption] = useState('');
  const [takenAt, setTakenAt] = useState<string | null>(null);
  const [position, setPosition] = useState<{ state: 'idle' | 'seeking' | 'none' } | { state: 'got'; lat: number; lon: number; accuracy: number }>({ state: 'idle' });
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [done, setDone] = useState<number | null>(null);
  const [dragging, setDragging] = useState(false);
  const [tooMany, setTooMany] = useState(0);
  const captionId = useId();
  const cameraRef = useRef<HTMLInputElement>(null);
  const filesRef = useRef<HTMLInputElement>(null);
  const stagedRef = useRef(staged);
  stagedRef.current = staged;

  useEffect(() => () => stagedRef.current.forEach((s) => URL.revokeObjectURL(s.url)), []);

  function add(files: FileList | File[] | null) {
    if (!files || files.length === 0) return;
    const list = Array.from(files);
    const images = list.filter((f) => f.type.startsWith('image/') || /\.(jpe?g|png|webp|heic|heif)$/i.test(f.name));
    setRefused(list.filter((f) => !images.includes(f)).map((f) => f.name));
    setDone(null);
    upload.reset();
    if (images.length === 0) return;
    const room = MAX_PER_UPLOAD - stagedRef.current.length;
    if (images.length > room) setTooMany(images.length - Math.max(0, room));
    else setTooMany(0);
    const taken = images.slice(0, Math.max(0, room));
    if (taken.length === 0) return;
    // Each photo gets its id when picked, so sending it again after a lost answer keeps one copy.
    setStaged((old) => [...old, ...taken.map((file) => ({ file, url: URL.createObjectURL(file), clientId: newClientId() }))]);
    // When and where: the moment the photos were taken or chosen, and the form's own fix.
    setTakenAt(new Date().toISOString());
    if (position.state !== 'got') {
      setPosition({ state: 'seeking' });
      void quickPosition().then((p) => setPosition(p ? { state: 'got', ...p } : { state: 'none' }));
    }
  }

  function removeAt(index: number) {
    setStaged((old) => {
      const next = [...old];
      const [gone] = next.splice(index, 1);
      if (gone) URL.revokeObjectURL(gone.url);
      return next;
    });
  }

  function clear() {
    staged.forEach((s) => URL.revokeObjectURL(s.url));
    setStaged([]);
    setCaption('');
    setProgress(null);
  }

  function send() {
    const files = staged.map((s) => s.file);
    setProgress({ loaded: 0, total: files.reduce((n, f) => n + f.size, 0) });
    upload.mutate(
      {
        files,
        context: {
          caption: caption.trim() || undefined,
          takenAt: takenAt ?? undefined,
          clientIds: staged.map((s) => s.clientId),
          ...(position.state === 'got' ? { lat: position.lat, lon: position.lon, accuracy: position.accuracy } : {}),
        },
        onProgress: setProgress,
      },
      {
        onSuccess: (photos) => {
          setDone(photos.length);
          setTooMany(0);
          clear();
        },
        onSettled: () => setProgress(null),
      },
    );
  }

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    add(e.dataTransfer.files);
  };

  const percent = progress && progress.total > 0 ? Math.min(100, Math.round((progress.loaded / progress.total) * 100)) : 0;

  return (
    <section
      aria-label="Add photos"
      onDragOver={(e) => {
        e.preventDefault();
        setDragging(true);
      }}
      onDragLeave={() => setDragging(false)}
      onDrop={onDrop}
      className={cn('space-y-3 rounded-lg border-2 border-dashed p-4', dragging ? 'border-brand-500 bg-brand-50' : 'border-ink-300 bg-white')}
    >
      <div className="flex flex-wrap items-center gap-2">
        <input
          ref={cameraRef}
          id={`${captionId}-camera`}
          type="file"
          accept="image/*"
          capture="environment"
          multiple
          className="sr-only"
          tabIndex={-1}
          aria-label="Take photos"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
        <input
          ref={filesRef}
          id={`${captionId}-files`}
          type="file"
          accept="image/*"
          multiple
          className="sr-only"
          tabIndex={-1}
          aria-label="Choose photo files"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
        <Button className="min-h-12 flex-1 sm:flex-none" onClick={() => cameraRef.current?.click()}>
          <CameraIcon /> Take photos
        </Button>
        <Button variant="secondary" className="min-h-12 flex-1 sm:flex-none" onClick={() => filesRef.current?.click()}>
          Choose files
        </Button>
        <p className="hidden text-sm text-ink-600 sm:block">or drop photos here</p>
      </div>
      <p className="text-xs text-ink-600">
        Useful shots: the line exposed with a rod or tape showing depth, the surface marker, and the restored surface. Photos are kept upright and
        their time and place recorded.
      </p>

      {refused.length > 0 && (
        <Alert tone="danger" title="Not a photo">
          <p>These files are not images and were left out: {refused.join(', ')}.</p>
        </Alert>
      )}

      {tooMany > 0 && (
        <Alert tone="caution">
          <p>
            Up to {MAX_PER_UPLOAD} photos go in one upload; {tooMany === 1 ? '1 photo was' : `${tooMany} photos were`} left out. Upload these, then add the rest.
          </p>
        </Alert>
      )}

      {staged.length > 0 && (
        <div className="space-y-3">
          <ul className="grid grid-cols-3 gap-2 sm:grid-cols-6" aria-label="Photos ready to upload">
            {staged.map((s, i) => (
              <li key={s.url} className="relative">
                <img src={s.url} alt={`Ready to upload: ${s.file.name}`} className="aspect-square w-full rounded-md object-cover" />
                <span className="block truncate text-xs text-ink-600">{sizeText(s.file.size)}</span>
                <button
                  type="button"
                  onClick={() => removeAt(i)}
                  disabled={upload.isPending}
                  className="absolute top-1 right-1 flex size-8 items-center justify-center rounded-full bg-ink-900/70 text-white"
                  aria-label={`Remove ${s.file.name}`}
                >
                  ×
                </button>
              </li>
            ))}
          </ul>
          <div className="flex flex-col gap-1">
            <label htmlFor={captionId} className="text-sm font-medium text-ink-800">
              Caption for these photos
            </label>
            <input
              id={captionId}
              value={caption}
              maxLength={300}
              onChange={(e) => setCaption(e.target.value)}
              placeholder={`e.g. ${holeNumber}: line exposed, tape on top of pipe`}
              className="min-h-11 rounded-md border border-ink-300 bg-white px-3 text-base sm:text-sm"
            />
          </div>
          <p className="text-xs text-ink-600">
            Taken {takenAt ? formatDateTime(takenAt) : '—'} ·{' '}
            {position.state === 'seeking'
              ? 'getting the position…'
              : position.state === 'got'
                ? `position recorded (±${formatNumber(position.accuracy, 0)} m)`
                : 'no position (location off or refused); the hole’s position still applies'}
          </p>
          {progress ? (
            <div className="space-y-1">
              <label className="text-sm text-ink-700" htmlFor={`${captionId}-progress`}>
                Uploading {staged.length} {staged.length === 1 ? 'photo' : 'photos'}: {percent} %
              </label>
              <progress id={`${captionId}-progress`} max={100} value={percent} className="h-3 w-full accent-brand-700" />
            </div>
          ) : (
            <div className="flex flex-wrap gap-2">
              <Button className="min-h-12 flex-1 sm:flex-none" onClick={send} busy={upload.isPending}>
                Upload {staged.length} {staged.length === 1 ? 'photo' : 'photos'}
              </Button>
              <Button variant="secondary" className="min-h-12" onClick={clear}>
                Clear
              </Button>
            </div>
          )}
        </div>
      )}
      {upload.isError && <ProblemAlert error={upload.error} />}
      {done != null && <Alert tone="success">{done === 1 ? '1 photo added.' : `${done} photos added.`}</Alert>}
    </section>
  );
}

function CameraIcon() {
  return (
    <svg aria-hidden viewBox="0 0 20 20" className="size-5 fill-current">
      <path d="M7.5 3 6.3 5H4a2 2 0 0 0-2 2v8a2 2 0 0 0 2 2h12a2 2 0 0 0 2-2V7a2 2 0 0 0-2-2h-2.3l-1.2-2h-5ZM10 7.5a3.5 3.5 0 1 1 0 7 3.5 3.5 0 0 1 0-7Z" />
    </svg>
  );
}

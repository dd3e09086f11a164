import { useRef, useState } from 'react';
import type { TilesetDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatNumber } from '@/lib/format';
import { useDeleteTileset, useUploadTileset } from '../api/upload-tileset';

/** Where the base map comes from, and (for administrators) uploading or removing an MBTiles file. */
export function BasemapPanel({ projectId, tileset, canUpload }: { projectId: number; tileset: TilesetDto | null; canUpload: boolean }) {
  const upload = useUploadTileset(projectId);
  const remove = useDeleteTileset(projectId);
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const source =
    !tileset || !tileset.available
      ? 'No base map: the map shows a plain grid of the project’s coordinates.'
      : tileset.source === 'uploaded'
        ? `Uploaded base map “${tileset.name ?? 'untitled'}”, zoom ${tileset.minZoom}–${tileset.maxZoom}, ${formatNumber(tileset.tileCount ?? 0, 0)} tiles.`
        : `Demo base map “${tileset.name ?? ''}” bundled with Threadline, zoom ${tileset.minZoom}–${tileset.maxZoom}.`;
  return (
    <section className="space-y-2 text-xs text-ink-700" aria-label="Base map">
      <h3 className="text-sm font-semibold text-ink-900">Base map</h3>
      <p>{source} Tiles are served by this server; nothing is fetched from elsewhere.</p>
      {tileset?.problem && <p className="text-danger-700">{tileset.problem}</p>}
      {canUpload && (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (file) upload.mutate(file, { onSuccess: () => { setFile(null); if (input.current) input.current.value = ''; } });
          }}
        >
          <label className="block text-xs font-medium text-ink-800" htmlFor="tileset-file">
            MBTiles file (raster PNG, JPEG or WebP tiles)
          </label>
          <input
            ref={input}
            id="tileset-file"
            type="file"
            accept=".mbtiles,application/vnd.sqlite3,application/x-sqlite3"
            className="block w-full text-xs file:mr-2 file:min-h-9 file:rounded file:border file:border-ink-300 file:bg-white file:px-2 file:text-xs"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          />
          <div className="flex flex-wrap gap-2">
            <Button type="submit" size="sm" busy={upload.isPending} disabled={!file}>
              Upload base map
            </Button>
            {tileset?.source === 'uploaded' && (
              <Button size="sm" variant="secondary" busy={remove.isPending} onClick={() => remove.mutate()}>
                Remove uploaded map
              </Button>
            )}
          </div>
          {upload.isPending && <p role="status">Uploading and checking the file…</p>}
          {upload.isError && <ProblemAlert error={upload.error} />}
          {remove.isError && <ProblemAlert error={remove.error} />}
        </form>
      )}
    </section>
  );
}

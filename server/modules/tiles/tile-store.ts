/**
 * Which MBTiles file is a project's base map, and the open read-only handles (one per file,
 * reopened when the file changes).
 *
 * Convention (no database column): an administrator's upload lives at
 * `<DATA_DIR>/tiles/<projectId>.mbtiles` and wins; otherwise a project whose name is that of a
 * demo scenario (the seeder matches projects by name too) uses the bundled
 * `tiles/<scenario-key>.mbtiles` rendered by `npm run tiles`; otherwise the project has no
 * base map and the client draws a plain grid.
 */
import { existsSync } from 'node:fs';
import { stat } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TilesetDto } from '@shared/api';
import { DEMO_SCENARIOS } from '../../../seeds/demo';
import type { Project } from '../projects/project.entity';
import { Mbtiles, MbtilesError } from './mbtiles';

/** The repository's tiles/ folder (committed MBTiles of the demo areas). */
export const BUNDLED_TILES_DIR = fileURLToPath(new URL('../../../tiles/', import.meta.url));

export type TileSource = 'uploaded' | 'bundled';

interface Located {
  path: string;
  source: TileSource;
}

interface CacheEntry {
  stamp: string;
  opening: Promise<Mbtiles>;
}

/** A project's open tile set with where it came from and a version that changes with the file. */
export interface OpenTileset {
  mbtiles: Mbtiles;
  source: TileSource;
  version: string;
}

export class TileStore {
  private readonly cache = new Map<string, CacheEntry>();

  constructor(
    private readonly dataDir: string,
    private readonly bundledDir: string = BUNDLED_TILES_DIR,
  ) {}

  /** Folder of uploaded tile sets. */
  get uploadDir(): string {
    return join(this.dataDir, 'tiles');
  }

  uploadedPath(projectId: number): string {
    return join(this.uploadDir, `${projectId}.mbtiles`);
  }

  /** The bundled demo tile set for a project named like a demo scenario, or null. */
  bundledPath(project: Pick<Project, 'name'>): string | null {
    const scenario = DEMO_SCENARIOS.find((s) => s.project.name === project.name);
    return scenario ? join(this.bundledDir, `${scenario.key}.mbtiles`) : null;
  }

  locate(project: Pick<Project, 'id' | 'name'>): Located | null {
    const uploaded = this.uploadedPath(project.id);
    if (existsSync(uploaded)) return { path: uploaded, source: 'uploaded' };
    const bundled = this.bundledPath(project);
    if (bundled && existsSync(bundled)) return { path: bundled, source: 'bundled' };
    return null;
  }

  /** The project's tile set, or null when it has none. Throws MbtilesError when its file is unusable. */
  async open(project: Pick<Project, 'id' | 'name'>): Promise<OpenTileset | null> {
    const found = this.locate(project);
    if (!found) return null;
    let info;
    try {
      info = await stat(found.path);
    } catch {
      return null;
    }
    const stamp = `${Math.round(info.mtimeMs).toString(36)}-${info.size.toString(36)}`;
    let entry = this.cache.get(found.path);
    if (!entry || entry.stamp !== stamp) {
      if (entry) void entry.opening.then((m) => m.close()).catch(() => undefined);
      entry = { stamp, opening: Mbtiles.open(found.path) };
      this.cache.set(found.path, entry);
      entry.opening.catch(() => {
        // do not keep a failed open: the next request tries again
        if (this.cache.get(found.path) === entry) this.cache.delete(found.path);
      });
    }
    const mbtiles = await entry.opening;
    return { mbtiles, source: found.source, version: stamp };
  }

  /** Close and forget the handle of a file (before it is replaced or removed). */
  async evict(path: string): Promise<void> {
    const entry = this.cache.get(path);
    this.cache.delete(path);
    if (entry) await entry.opening.then((m) => m.close()).catch(() => undefined);
  }

  /** What the map needs to know about the project's base map. */
  async describe(project: Pick<Project, 'id' | 'name'>): Promise<TilesetDto> {
    const none: TilesetDto = {
      available: false, source: null, name: null, format: null, bounds: null, minZoom: null, maxZoom: null,
      attribution: null, tileCount: null, version: null, problem: null,
    };
    let open: OpenTileset | null;
    try {
      open = await this.open(project);
    } catch (e) {
      if (e instanceof MbtilesError) return { ...none, source: this.locate(project)?.source ?? null, problem: `The base map file cannot be used: ${e.message}.` };
      throw e;
    }
    if (!open) return none;
    const i = open.mbtiles.info;
    return {
      available: true,
      source: open.source,
      name: i.name,
      format: i.format,
      bounds: i.bounds,
      minZoom: i.minZoom,
      maxZoom: i.maxZoom,
      attribution: i.attribution,
      tileCount: i.tileCount,
      version: open.version,
      problem: null,
    };
  }

  /** Close every handle (tests, shutdown). */
  async closeAll(): Promise<void> {
    const entries = [...this.cache.values()];
    this.cache.clear();
    await Promise.all(entries.map((e) => e.opening.then((m) => m.close()).catch(() => undefined)));
  }
}

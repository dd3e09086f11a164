import { mkdir, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { dirname, join, relative, resolve, sep } from 'node:path';

/**
 * Where uploaded files live. Keys are server-made (`photos/<project>/<uuid>.jpg`), never client
 * names. Two implementations: `DiskStorage` (a folder, the default) and `S3Storage`
 * (`./s3-storage.ts`, S3-compatible object storage); `createStorage(config)` picks one.
 */
export interface FileStorage {
  /** Write (or overwrite) the file under the key. */
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  /** The file, or null when there is none. */
  get(key: string): Promise<Buffer | null>;
  /** Remove the file; removing a missing file is not an error. */
  delete(key: string): Promise<void>;
  /** Every key starting with the prefix, sorted (for checks and clean-up, not for hot paths). */
  list(prefix: string): Promise<string[]>;
}

const KEY_PATTERN = /^[a-z0-9][a-z0-9/_.-]{0,199}$/;

/** Refuse anything that is not a server-made key (no `..`, no absolute paths, no odd characters). */
export function assertKey(key: string): void {
  if (!KEY_PATTERN.test(key) || key.includes('..') || key.includes('//')) throw new Error(`invalid storage key: ${key}`);
}

/** Files in a folder on disk (the embedded default: the data folder). */
export class DiskStorage implements FileStorage {
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
  }

  private pathOf(key: string): string {
    assertKey(key);
    const full = resolve(join(this.root, key));
    if (!full.startsWith(this.root + sep)) throw new Error(`storage key escapes the root: ${key}`);
    return full;
  }

  async put(key: string, data: Buffer, _contentType?: string): Promise<void> {
    const path = this.pathOf(key);
    await mkdir(dirname(path), { recursive: true });
    await writeFile(path, data);
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await readFile(this.pathOf(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async list(prefix: string): Promise<string[]> {
    let entries: string[];
    try {
      entries = await readdir(this.root, { recursive: true });
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return [];
      throw err;
    }
    const keys: string[] = [];
    for (const entry of entries) {
      const key = relative(this.root, join(this.root, entry)).split(sep).join('/');
      if (!key.startsWith(prefix)) continue;
      if (KEY_PATTERN.test(key) && (await isFile(join(this.root, entry)))) keys.push(key);
    }
    return keys.sort();
  }
}

async function isFile(path: string): Promise<boolean> {
  return (await stat(path)).isFile();
}

/** Files in memory, for tests. */
export class MemoryStorage implements FileStorage {
  private readonly files = new Map<string, Buffer>();
  async put(key: string, data: Buffer, _contentType?: string): Promise<void> {
    this.files.set(key, data);
  }
  async get(key: string): Promise<Buffer | null> {
    return this.files.get(key) ?? null;
  }
  async delete(key: string): Promise<void> {
    this.files.delete(key);
  }
  async list(prefix: string): Promise<string[]> {
    return [...this.files.keys()].filter((k) => k.startsWith(prefix)).sort();
  }
}

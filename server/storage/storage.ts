import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { dirname, join, resolve, sep } from 'node:path';

/** Where uploaded files live. Keys are server-made (`photos/<project>/<uuid>.jpg`), never client names. */
export interface FileStorage {
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}

const KEY_PATTERN = /^[a-z0-9][a-z0-9/_.-]{0,199}$/;

/** Files in a folder on disk (the embedded default: the data folder). */
export class DiskStorage implements FileStorage {
  private readonly root: string;

  constructor(root: string) {
    this.root = resolve(root);
  }

  private pathOf(key: string): string {
    if (!KEY_PATTERN.test(key) || key.includes('..')) throw new Error(`invalid storage key: ${key}`);
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
}

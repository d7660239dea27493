// Where file bytes live. The embedded default is a folder under the data directory;
// another backend (an object store) implements the same three calls.
import { createHash } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';

export interface Storage {
  put(key: string, bytes: Uint8Array): Promise<void>;
  get(key: string): Promise<Uint8Array>;
  delete(key: string): Promise<void>;
}

export class LocalFolderStorage implements Storage {
  constructor(private readonly root: string) {}

  private resolve(key: string): string {
    if (!/^[a-z0-9][a-z0-9/_.-]*$/i.test(key) || key.includes('..'))
      throw new Error(`bad storage key ${key}`);
    return path.join(this.root, key);
  }

  async put(key: string, bytes: Uint8Array) {
    const file = this.resolve(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    await fs.writeFile(tmp, bytes);
    await fs.rename(tmp, file);
  }

  async get(key: string) {
    return new Uint8Array(await fs.readFile(this.resolve(key)));
  }

  async delete(key: string) {
    await fs.rm(this.resolve(key), { force: true });
  }
}

export function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

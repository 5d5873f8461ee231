// The recent-files list, kept as a small JSON file in the user's data folder.

import { promises as fs } from 'node:fs';
import path from 'node:path';

export const RECENT_LIMIT = 10;

export interface RecentFiles {
  list(): Promise<string[]>;
  add(filePath: string): Promise<string[]>;
  remove(filePath: string): Promise<string[]>;
}

export function createRecentFiles(storeFile: string, limit = RECENT_LIMIT): RecentFiles {
  const load = async (): Promise<string[]> => {
    try {
      const data: unknown = JSON.parse(await fs.readFile(storeFile, 'utf8'));
      if (!Array.isArray(data)) return [];
      return data.filter((p): p is string => typeof p === 'string' && p.length > 0).slice(0, limit);
    } catch {
      return []; // missing or damaged list: start a new one
    }
  };
  const save = async (list: string[]): Promise<string[]> => {
    await fs.mkdir(path.dirname(storeFile), { recursive: true });
    await fs.writeFile(storeFile, JSON.stringify(list, null, 1));
    return list;
  };
  return {
    list: load,
    async add(filePath) {
      const abs = path.resolve(filePath);
      const list = (await load()).filter((p) => p !== abs);
      return save([abs, ...list].slice(0, limit));
    },
    async remove(filePath) {
      const abs = path.resolve(filePath);
      return save((await load()).filter((p) => p !== abs));
    },
  };
}

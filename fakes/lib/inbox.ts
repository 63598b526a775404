import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export interface Inbox<T> {
  push(item: T): void;
  list(): readonly T[];
  clear(): void;
}

/**
 * What a fake received. With a file (npm start keeps it under .data/fakes/) every message is appended as one JSON
 * line as it arrives and read back at start, so a restarted fake still lists and finds what it accepted before.
 */
export function createInbox<T>(file?: string): Inbox<T> {
  const items: T[] = [];
  if (file) {
    mkdirSync(path.dirname(file), { recursive: true });
    if (existsSync(file)) {
      for (const line of readFileSync(file, 'utf8').split('\n')) {
        if (!line.trim()) continue;
        try {
          items.push(JSON.parse(line) as T);
        } catch {
          // A line cut short by a crash mid-write is the only thing that can be lost; the rest still loads.
        }
      }
    }
  }
  return {
    push(item) {
      items.push(item);
      if (file) appendFileSync(file, `${JSON.stringify(item)}\n`);
    },
    list: () => items,
    clear() {
      items.splice(0);
      if (file) writeFileSync(file, '');
    },
  };
}

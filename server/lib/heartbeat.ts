import { hostname } from 'node:os';
import type { Redis } from 'ioredis';

// Each worker process writes its heartbeat to Redis; the API's readiness check reads them back.
export const HEARTBEAT_EVERY_MS = 15_000;
/** A worker not heard from for longer than this is reported missing. */
export const HEARTBEAT_STALE_MS = 60_000;

const keyPrefix = (queuePrefix: string) => `${queuePrefix}:worker-heartbeat:`;

export function workerId(): string {
  return `${hostname()}:${process.pid}`;
}

export async function beat(redis: Redis, queuePrefix: string, id: string, at: Date): Promise<void> {
  // Kept a while after it goes stale so readiness can say which worker went quiet, then it expires.
  await redis.set(`${keyPrefix(queuePrefix)}${id}`, at.toISOString(), 'PX', 10 * HEARTBEAT_STALE_MS);
}

export async function stopBeating(redis: Redis, queuePrefix: string, id: string): Promise<void> {
  await redis.del(`${keyPrefix(queuePrefix)}${id}`);
}

export interface WorkerBeat { id: string; lastSeen: string; ageSeconds: number; stale: boolean }

export async function readBeats(redis: Redis, queuePrefix: string, now: Date): Promise<WorkerBeat[]> {
  const keys: string[] = [];
  let cursor = '0';
  do {
    const [next, found] = await redis.scan(cursor, 'MATCH', `${keyPrefix(queuePrefix)}*`, 'COUNT', 200);
    keys.push(...found);
    cursor = next;
  } while (cursor !== '0');
  if (keys.length === 0) return [];
  const values = await redis.mget(...keys);
  return keys.flatMap((key, i) => {
    const value = values[i];
    if (!value) return [];
    const age = now.getTime() - new Date(value).getTime();
    return [{ id: key.slice(keyPrefix(queuePrefix).length), lastSeen: value, ageSeconds: Math.max(0, Math.round(age / 1000)), stale: age > HEARTBEAT_STALE_MS }];
  }).sort((a, b) => a.id.localeCompare(b.id));
}

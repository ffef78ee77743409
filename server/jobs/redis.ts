/**
 * Connections to the Redis that carries the task queue (REDIS_URL): one line and a refusal when it cannot be
 * reached at start, and once running, reconnection with a capped exponential backoff that is reported when
 * the connection drops and when it is back.
 */
import IORedis, { type RedisOptions } from 'ioredis';

/** The address without any password, for messages. */
export function shownUrl(url: string): string {
  try {
    const u = new URL(url);
    u.password = '';
    u.username = '';
    return u.toString().replace(/\/$/, '');
  } catch {
    return 'an unreadable REDIS_URL';
  }
}

export class RedisUnreachable extends Error {
  constructor(url: string, reason: string) {
    super(`Cannot reach Redis at ${shownUrl(url)} (REDIS_URL): ${reason}. Start redis-server there or fix REDIS_URL.`);
    this.name = 'RedisUnreachable';
  }
}

/** Backoff between reconnection attempts: 200 ms doubling to at most 5 s (common practice, no source). */
export const reconnectDelay = (attempt: number) => Math.min(5000, 200 * 2 ** Math.min(attempt - 1, 5));

/** Opens a connection with the backoff, reporting drops and recoveries through `log` once each. */
export function redisConnection(url: string, who: string, log: (line: string) => void = console.error, extra: RedisOptions = {}): IORedis {
  let lost = false;
  const conn = new IORedis(url, {
    // BullMQ's blocking commands need commands to wait for a reconnection rather than fail after a few tries.
    maxRetriesPerRequest: null,
    retryStrategy: (attempt) => {
      const delay = reconnectDelay(attempt);
      if (!lost) log(`${who}: lost Redis at ${shownUrl(url)}; reconnecting (next try in ${delay} ms, backing off to 5 s).`);
      lost = true;
      return delay;
    },
    ...extra,
  });
  conn.on('error', () => undefined);
  conn.on('ready', () => {
    if (lost) log(`${who}: reconnected to Redis at ${shownUrl(url)}.`);
    lost = false;
  });
  return conn;
}

/** Connects once, pings and disconnects; throws RedisUnreachable with the reason when that fails. */
export async function assertRedisReachable(url: string, timeoutMs = 3000): Promise<void> {
  let conn: IORedis;
  try {
    conn = new IORedis(url, { lazyConnect: true, connectTimeout: timeoutMs, maxRetriesPerRequest: 0, retryStrategy: () => null, enableOfflineQueue: false });
  } catch (err) {
    throw new RedisUnreachable(url, (err as Error).message);
  }
  let reason = '';
  conn.on('error', (err) => (reason ||= err.message));
  try {
    await conn.connect();
    await conn.ping();
  } catch (err) {
    throw new RedisUnreachable(url, reason || (err as Error).message);
  } finally {
    conn.disconnect();
  }
}

/**
 * `npm run worker`: a worker process for the task queue in Redis (REDIS_URL), on this or any machine that
 * can reach it. Runs TREADLE_WORKER_CONCURRENCY tasks at once (default one per core). It never opens the
 * database; the server stores what it computes.
 */
import { RedisUnreachable, assertRedisReachable, shownUrl } from './jobs/redis';
import { startQueueWorker } from './jobs/queue-worker';

async function main(): Promise<void> {
  const url = process.env.REDIS_URL;
  if (!url) {
    console.error('npm run worker needs REDIS_URL, the Redis the Treadle server queues its work on (e.g. REDIS_URL=redis://10.0.0.5:6379).');
    process.exit(1);
  }
  await assertRedisReachable(url);
  const worker = await startQueueWorker({ url });
  console.log(`Treadle worker ${worker.name}: taking up to ${worker.concurrency} tasks at once from ${shownUrl(url)}.`);
  let stopping = false;
  const stop = () => {
    // A second signal stops at once: the tasks in hand are taken up by another worker once their locks run out.
    if (stopping) process.exit(1);
    stopping = true;
    // Tasks in hand finish first, but not for ever: with Redis gone, closing would wait on it indefinitely.
    setTimeout(() => process.exit(1), 30_000).unref();
    worker.close().then(() => process.exit(0), () => process.exit(1));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err) => {
  console.error(err instanceof RedisUnreachable ? err.message : err);
  process.exit(1);
});

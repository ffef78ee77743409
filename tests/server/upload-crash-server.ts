/**
 * The real server as its own process for the crash test (tests/server/upload-crash.test.ts): `node --import tsx`
 * (one process, so a SIGKILL ends the server itself and not a wrapper), configured from the environment like
 * `npm start` (TREADLE_DB, TREADLE_DATA_DIR, PORT=0), mail dropped. Prints "listening <url>" once it serves.
 */
import { readConfig } from '../../server/config';
import { startWithLocalPayments } from '../../server/launch/local-payments';

async function main() {
  const config = readConfig({ ...process.env, PORT: '0', HOST: '127.0.0.1' });
  const running = await startWithLocalPayments(config, { mailer: { send: async () => undefined } });
  process.stdout.write(`listening ${running.url.replace('localhost', '127.0.0.1')}\n`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});

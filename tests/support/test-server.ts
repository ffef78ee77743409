import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startWithLocalPayments, type RunningWithPayments } from '../../server/launch/local-payments';
import { projectRoot } from '../../server/config';
import { seedDemoStudio } from '../../seeds/demo-studio';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail-catcher';
import { smtpMailer } from '../../server/services/mail';

/** The real server on a random loopback port, over a fresh SQLite file seeded with the demo studio. */
export async function startTestServer(): Promise<RunningWithPayments & { mail: MailCatcher; stop(): Promise<void> }> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-e2e-'));
  // Helpers building their own export (npx expo export --output-dir DIR) point TREADLE_WEB_DIR at it.
  const webDir = process.env.TREADLE_WEB_DIR ?? path.join(projectRoot, 'dist');
  if (!fs.existsSync(path.join(webDir, 'index.html'))) throw new Error('No web export in dist/: run `npm run build:web` (npm test does it).');
  const mail = await startMailCatcher({ inboxPort: 0 });
  const mailer = smtpMailer({ host: '127.0.0.1', port: mail.smtpPort });
  const running = await startWithLocalPayments({
    port: 0,
    host: '127.0.0.1',
    databaseFile: path.join(dir, 'e2e.sqlite'),
    dataDir: path.join(dir, 'files'),
    webDir,
    sessionSecret: 'e2e-secret',
    secureCookies: false,
    inboxPort: 0,
  }, { mailer, localInboxUrl: mail.inboxUrl });
  await seedDemoStudio(running.db, { now: Date.now(), dataDir: path.join(dir, 'files') });
  return {
    ...running,
    mail,
    async stop() {
      await running.close();
      mailer.close();
      await mail.stop();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/**
 * Forced stops on the upload's storage path, for the crash test (tests/server/upload-crash.test.ts) and for
 * anyone who wants to see what a crash at that moment leaves behind. Off unless TREADLE_UPLOAD_FAULT is set
 * (never honoured when NODE_ENV=production): "<point>:pause" prints a line and waits forever, so the test can
 * kill -9 the process there; "<point>:exit" kills the process at once with SIGKILL.
 */
export type FaultPoint = 'before-rename' | 'after-rename' | 'before-commit' | 'after-commit';

export const FAULT_PAUSED_LINE = 'treadle-upload-fault-paused';

export async function faultPoint(point: FaultPoint): Promise<void> {
  const setting = process.env.TREADLE_UPLOAD_FAULT;
  if (!setting || process.env.NODE_ENV === 'production') return;
  const [at, action] = setting.split(':');
  if (at !== point) return;
  if (action === 'exit') process.kill(process.pid, 'SIGKILL');
  process.stdout.write(`${FAULT_PAUSED_LINE} ${point}\n`);
  await new Promise<never>(() => {});
}

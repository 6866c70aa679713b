import { execFile } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, '../..');

export type OwnMariaDb = {
  port: number;
  dir: string;
  /** Shuts the server down (as an operator or a crash would end it). */
  stop: () => Promise<void>;
  start: () => Promise<void>;
  /** Freezes the server process: connections stay open and nothing answers (a hung host). */
  pause: () => void;
  resume: () => void;
  /** Stops it for good (resuming it first if paused). */
  destroy: () => Promise<void>;
};

const portIsFree = (port: number) =>
  new Promise<boolean>((resolve) => {
    const probe = net.createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
  });

function isRunning(dir: string): boolean {
  try {
    process.kill(Number(fs.readFileSync(path.join(dir, 'mariadbd.pid'), 'utf8').trim()), 0);
    return true;
  } catch {
    return false;
  }
}

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const probe = net.createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });

/**
 * A MariaDB of the test's own, through scripts/db.sh with its own port and data folder, so a test can
 * stop, freeze and restart it without touching the shared test instance. The port is the test
 * instance's + 100 when free, else any free port; the data folder lives under .db-test/.
 */
export async function startOwnMariaDb(): Promise<OwnMariaDb> {
  const preferred = Number(process.env.DB_PORT || 3317) + 100;
  const dirFor = (p: number) => path.join(ROOT, '.db-test', `own-${p}`);
  // Taken by our own instance left running by an interrupted run: use it again.
  const ours = isRunning(dirFor(preferred));
  const port = ours || (await portIsFree(preferred)) ? preferred : await freePort();
  const dir = dirFor(port);
  const keepDir = port === preferred;
  const env = { ...process.env, DB_DIR: dir, DB_PORT: String(port) };
  const db = (command: 'start' | 'stop') => run('bash', [path.join(ROOT, 'scripts/db.sh'), command], { cwd: ROOT, env, timeout: 120_000 });
  const pid = () => Number(fs.readFileSync(path.join(dir, 'mariadbd.pid'), 'utf8').trim());
  let paused = false;
  await db('start');
  return {
    port,
    dir,
    stop: async () => {
      await db('stop');
    },
    start: async () => {
      await db('start');
    },
    pause: () => {
      process.kill(pid(), 'SIGSTOP');
      paused = true;
    },
    resume: () => {
      if (paused) process.kill(pid(), 'SIGCONT');
      paused = false;
    },
    destroy: async () => {
      try {
        if (paused) process.kill(pid(), 'SIGCONT');
      } catch {
        // not running
      }
      await db('stop').catch(() => undefined);
      // A folder for a one-off port is not worth keeping; the usual one is reused next time.
      if (!keepDir) fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

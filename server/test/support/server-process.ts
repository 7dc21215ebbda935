import { type ChildProcess, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { TEST_JWT_SECRET } from './app';

/** The built server; PANELPASS_SERVER_MAIN points at another build (a private dist folder). */
const MAIN = process.env.PANELPASS_SERVER_MAIN ?? join(__dirname, '..', '..', 'dist', 'main.js');

/** The built server as a real process, to kill and restart in fault tests. */
export class ServerProcess {
  private child: ChildProcess | null = null;
  readonly url: string;

  constructor(readonly port: number) {
    this.url = `http://127.0.0.1:${port}`;
  }

  async start(): Promise<void> {
    if (!existsSync(MAIN))
      throw new Error(`${MAIN} is missing: build the server first (npm run build -w server)`);
    this.child = spawn(process.execPath, [MAIN], {
      env: {
        ...process.env,
        NODE_ENV: 'test',
        HOST: '127.0.0.1',
        PORT: String(this.port),
        JWT_SECRET: TEST_JWT_SECRET,
        SIGN_IN_LIMIT: '1000',
      },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    for (let i = 0; i < 200; i++) {
      try {
        const res = await fetch(`${this.url}/api/health`);
        if (res.ok) return;
      } catch {
        // not listening yet
      }
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error('server did not start');
  }

  /** SIGKILL: no shutdown hooks, open transactions are cut off. */
  async kill(): Promise<void> {
    const child = this.child;
    if (!child || child.exitCode !== null) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill('SIGKILL');
    await exited;
    this.child = null;
  }
}

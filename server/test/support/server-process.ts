import { type ChildProcess, spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { TEST_JWT_SECRET } from './app';

/** The built server; PANELPASS_SERVER_MAIN points at another build (a private dist folder). */
const MAIN = process.env.PANELPASS_SERVER_MAIN ?? join(__dirname, '..', '..', 'dist', 'main.js');

/** The built migration runner beside it. */
export const MIGRATE = join(dirname(MAIN), 'database', 'migrate.js');

export interface ServerProcessOptions {
  /** Another database than the tests' DATABASE_URL (a throwaway cluster of a fault test). */
  databaseUrl?: string;
  /** More environment (FOLLOW_UPS=on…). */
  env?: Record<string, string>;
  /** Keep what the process writes (stdout and stderr) in `output` instead of showing stderr. */
  captureOutput?: boolean;
}

/** The built server as a real process, to kill and restart in fault tests. */
export class ServerProcess {
  private child: ChildProcess | null = null;
  readonly url: string;
  /** Everything the process wrote, with captureOutput. */
  output = '';

  constructor(
    readonly port: number,
    private readonly options: ServerProcessOptions = {},
  ) {
    this.url = `http://127.0.0.1:${port}`;
  }

  /** The running process's id; null when it is not running (never started, killed or exited). */
  get pid(): number | null {
    const child = this.child;
    return child && child.exitCode === null && child.signalCode === null
      ? (child.pid ?? null)
      : null;
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
        ...(this.options.databaseUrl ? { DATABASE_URL: this.options.databaseUrl } : {}),
        ...this.options.env,
      },
      stdio: [
        'ignore',
        this.options.captureOutput ? 'pipe' : 'ignore',
        this.options.captureOutput ? 'pipe' : 'inherit',
      ],
    });
    const keep = (chunk: Buffer) => (this.output += chunk.toString());
    this.child.stdout?.on('data', keep);
    this.child.stderr?.on('data', keep);
    // Up to 30 s: on a busy machine (2 cores shared with other work) Nest takes a while to boot.
    const child = this.child;
    for (let i = 0; i < 600; i++) {
      if (child.exitCode !== null) {
        throw new Error(`server exited with ${child.exitCode} while starting\n${this.output}`);
      }
      try {
        const res = await fetch(`${this.url}/api/health`);
        if (res.ok) return;
      } catch {
        // not listening yet
      }
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error(`server did not start\n${this.output}`);
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

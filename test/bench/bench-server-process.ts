import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { createInterface } from 'node:readline';

const ROOT = path.resolve(__dirname, '../..');

/** What `collab-bench-server.ts` reports about itself. */
export interface Stats {
  cpuCores: number;
  loopP50Ms: number;
  loopP99Ms: number;
  loopMaxMs: number;
  /** Synchronous time in the `plan:sync` handler per message (decode, apply, broadcast). */
  syncHandlerP50Ms: number;
  syncHandlerP99Ms: number;
  syncMessages: number;
  /** Client send stamp → start of the server's handler (client egress, loopback, queueing). */
  inboundP50Ms: number;
  inboundP99Ms: number;
  rssMb: number;
  heapMb: number;
  rooms: number;
}

/** A relay server in its own process (`collab-bench-server.ts`). */
export class BenchServer {
  private readonly pending: Array<(s: Stats) => void> = [];
  url = '';

  private constructor(readonly child: ChildProcess) {}

  static async start(mode: 'full' | 'bare', databaseUrl: string): Promise<BenchServer> {
    const child = spawn(
      process.execPath,
      ['--import', 'tsx', 'test/bench/collab-bench-server.ts'],
      {
        cwd: ROOT,
        env: {
          ...process.env,
          MODE: mode,
          DATABASE_URL: databaseUrl,
          TSX_TSCONFIG_PATH: 'tsconfig.server.json',
        },
        stdio: ['pipe', 'pipe', 'inherit'],
      },
    );
    const server = new BenchServer(child);
    await new Promise<void>((resolve, reject) => {
      child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
      createInterface({ input: child.stdout! }).on('line', (line) => {
        const ready = /^READY (\d+)/.exec(line);
        if (ready) {
          server.url = `http://127.0.0.1:${ready[1]}`;
          resolve();
        }
        if (line.startsWith('STATS ')) server.pending.shift()?.(JSON.parse(line.slice(6)) as Stats);
      });
    });
    return server;
  }

  stats(reset = false): Promise<Stats> {
    return new Promise((resolve) => {
      this.pending.push(resolve);
      this.child.stdin!.write(reset ? 'reset\n' : 'stats\n');
    });
  }

  /** Stops the process; a no-op once it has exited (so it may be called twice). */
  stop(): Promise<void> {
    if (this.child.exitCode !== null || this.child.signalCode !== null) return Promise.resolve();
    return new Promise((resolve) => {
      this.child.once('exit', () => resolve());
      this.child.kill('SIGTERM');
      setTimeout(() => this.child.kill('SIGKILL'), 15_000).unref();
    });
  }
}

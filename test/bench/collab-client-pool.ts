import { fork, type ChildProcess } from 'node:child_process';
import path from 'node:path';

import {
  benchNow,
  type ClientSpec,
  type FromWorker,
  type ToWorker,
  type WorkerResult,
} from './collab-client-protocol';

const ROOT = path.resolve(__dirname, '../..');

/** One forked client process (`collab-client-worker.ts`), answering one request at a time. */
class ClientWorker {
  private readonly waiting: Array<{
    resolve: (m: FromWorker) => void;
    reject: (e: Error) => void;
  }> = [];

  constructor(readonly child: ChildProcess) {
    child.on('message', (m: FromWorker) => {
      const next = this.waiting.shift();
      if (!next) return;
      if (m.kind === 'failed') next.reject(new Error(`client worker: ${m.message}`));
      else next.resolve(m);
    });
    child.once('exit', (code) => {
      for (const w of this.waiting.splice(0)) w.reject(new Error(`client worker exited (${code})`));
    });
  }

  request(message: ToWorker, timeoutMs = 120_000): Promise<FromWorker> {
    return new Promise((resolve, reject) => {
      const timer = setTimeout(
        () => reject(new Error(`client worker: no answer to ${message.kind}`)),
        timeoutMs,
      );
      this.waiting.push({
        resolve: (m) => {
          clearTimeout(timer);
          resolve(m);
        },
        reject: (e) => {
          clearTimeout(timer);
          reject(e);
        },
      });
      this.child.send(message);
    });
  }
}

/**
 * Simulated clients spread round-robin over forked processes, so decoding broadcasts for a
 * thousand clients does not queue on one thread. All figures use `benchNow()`.
 */
export class ClientPool {
  private constructor(private readonly workers: ClientWorker[]) {}

  static start(count: number): ClientPool {
    const workers = Array.from(
      { length: count },
      () =>
        new ClientWorker(
          fork(path.join(ROOT, 'test/bench/collab-client-worker.ts'), [], {
            cwd: ROOT,
            execArgv: ['--import', 'tsx'],
            env: { ...process.env, TSX_TSCONFIG_PATH: 'tsconfig.server.json' },
            stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
          }),
        ),
    );
    return new ClientPool(workers);
  }

  get size(): number {
    return this.workers.length;
  }

  /** Connects `specs` (client i goes to worker i mod n) and waits until all are synced. */
  async connect(url: string, specs: ClientSpec[]): Promise<void> {
    const parts = this.workers.map((_, w) => specs.filter((_, i) => i % this.workers.length === w));
    await Promise.all(
      this.workers.map((w, i) => w.request({ kind: 'connect', url, clients: parts[i]! })),
    );
  }

  /**
   * Largest clock disagreement between this process and a worker, estimated NTP-style from the
   * best of 20 IPC round trips: |worker stamp − midpoint of the round trip| ± half of it.
   */
  async clockSkew(): Promise<{ skewMs: number; uncertaintyMs: number }> {
    let skew = 0;
    let uncertainty = 0;
    for (const w of this.workers) {
      let best = { rtt: Infinity, offset: 0 };
      for (let i = 0; i < 20; i++) {
        const t0 = benchNow();
        const m = await w.request({ kind: 'clock' });
        const t2 = benchNow();
        if (m.kind !== 'clock') throw new Error('client worker: unexpected clock answer');
        if (t2 - t0 < best.rtt) best = { rtt: t2 - t0, offset: m.now - (t0 + t2) / 2 };
      }
      skew = Math.max(skew, Math.abs(best.offset));
      uncertainty = Math.max(uncertainty, best.rtt / 2);
    }
    return { skewMs: skew, uncertaintyMs: uncertainty };
  }

  /** Starts the scenario in every worker; resolves once all of them are running it. */
  async go(seconds: number): Promise<void> {
    await Promise.all(this.workers.map((w) => w.request({ kind: 'go', seconds })));
  }

  /** Stops the scenario and returns every worker's figures. */
  async collect(): Promise<WorkerResult[]> {
    const answers = await Promise.all(this.workers.map((w) => w.request({ kind: 'collect' })));
    return answers.map((m) => {
      if (m.kind !== 'result') throw new Error('client worker: unexpected collect answer');
      return m.result;
    });
  }

  /** Disconnects every client (the workers stay for the next scenario). */
  async closeClients(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.request({ kind: 'close' })));
  }

  /** Ends the worker processes. */
  stop(): void {
    for (const w of this.workers) if (w.child.connected) w.child.disconnect();
  }
}

/**
 * The built server for a benchmark: a free loopback port, `src/server/main.ts` started with the
 * given environment (BENCH_CPU_PROFILE=folder writes its CPU profile there), and a wait until
 * `/api/health` answers. Sign-in throttling stays on with its per-address limit raised, since
 * every simulated person signs in from the same loopback address.
 */
import { spawn, type ChildProcess, type StdioOptions } from 'node:child_process';
import { createServer } from 'node:net';

export interface BenchServer {
  base: string;
  process: ChildProcess;
}

function freePort(): Promise<number> {
  return new Promise((res) => {
    const s = createServer();
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => res(typeof a === 'object' && a ? a.port : 0));
    });
  });
}

/** @throws when the server does not answer within `timeoutMs`. */
export async function startBenchServer(root: string, env: NodeJS.ProcessEnv, stdio: StdioOptions = 'ignore', timeoutMs = 300_000): Promise<BenchServer> {
  const port = await freePort();
  const base = `http://localhost:${port}`;
  const profile = process.env.BENCH_CPU_PROFILE ? ['--cpu-prof', '--cpu-prof-dir', process.env.BENCH_CPU_PROFILE] : [];
  const child = spawn(process.execPath, [...profile, '--import', 'tsx', 'src/server/main.ts'], { cwd: root, env: { ...env, HOST: 'localhost', PORT: String(port), PLUMBLINE_SIGNIN_RATE: '1000' }, stdio });
  for (const until = Date.now() + timeoutMs; Date.now() < until; ) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return { base, process: child };
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  child.kill('SIGTERM');
  throw new Error('the server did not start');
}

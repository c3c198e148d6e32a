import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { ROOT } from '../lib/paths.mjs';

// Starts a server as a child process on loopback, waits until it answers, and stops it again.

export interface RunningServer {
  name: string;
  origin: string;
  stop: () => Promise<void>;
}

/** A port nothing listens on right now, picked by the kernel on 127.0.0.1. */
export function freeLoopbackPort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => (port ? resolve(port) : reject(new Error('no port'))));
    });
  });
}

function waitForExit(child: ChildProcess, ms: number): Promise<boolean> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve(true);
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve(false), ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve(true);
    });
  });
}

export interface StartOptions {
  name: string;
  args: string[];
  env: Record<string, string>;
  port: number;
  readyPath: string;
  readyWithinMs?: number;
}

export async function startServer(options: StartOptions): Promise<RunningServer> {
  const origin = `http://127.0.0.1:${options.port}`;
  const child = spawn(process.execPath, options.args, {
    cwd: ROOT,
    env: { ...process.env, ...options.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  // Keep the tail of the child's output for the error message if it fails to start.
  const tail: string[] = [];
  const keep = (chunk: Buffer) => {
    tail.push(...chunk.toString().split('\n').filter(Boolean));
    tail.splice(0, Math.max(0, tail.length - 30));
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);

  const stop = async () => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    child.kill('SIGTERM');
    if (!(await waitForExit(child, 5000))) {
      child.kill('SIGKILL');
      await waitForExit(child, 2000);
    }
  };

  const deadline = Date.now() + (options.readyWithinMs ?? 30_000);
  while (Date.now() < deadline) {
    if (child.exitCode !== null) break;
    try {
      const response = await fetch(`${origin}${options.readyPath}`, { signal: AbortSignal.timeout(1000) });
      if (response.ok) return { name: options.name, origin, stop };
    } catch {
      // Not listening yet.
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  await stop();
  throw new Error(`${options.name} did not become ready on ${origin}${options.readyPath}:\n${tail.join('\n')}`);
}

import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';

const repoRoot = path.resolve(__dirname, '../../..');
export const builtApi = path.join(repoRoot, 'api/dist/src/main.js');

/** A TCP port free on 127.0.0.1 right now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

export interface ApiProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** Everything the process wrote to stdout and stderr so far, line by line. */
  lines: string[];
  output: () => string;
  /** SIGTERM, then waits for the exit (SIGKILL after `graceMs`); resolves with the exit code. */
  stop: (graceMs?: number) => Promise<number | null>;
}

/**
 * The built API (`npm run build` first; `npm test` builds before it runs vitest) as its own
 * operating-system process, the way `npm start` and a deployment run it, with stdout and stderr
 * captured. Resolves once /api/health answers 200.
 */
export async function startApiProcess(env: Record<string, string>, timeoutMs = 60_000): Promise<ApiProcess> {
  if (!existsSync(builtApi)) throw new Error(`${builtApi} is missing: run \`npm run build\` before these tests (npm test does).`);
  const port = env.PORT ? Number(env.PORT) : await freePort();
  const lines: string[] = [];
  const child = spawn(process.execPath, [builtApi], {
    cwd: repoRoot,
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', NODE_ENV: 'test', SERVE_APPS: 'false', ...env, PORT: String(port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  for (const stream of [child.stdout!, child.stderr!]) {
    let rest = '';
    stream.setEncoding('utf8');
    stream.on('data', (chunk: string) => {
      const parts = (rest + chunk).split('\n');
      rest = parts.pop() ?? '';
      lines.push(...parts);
    });
    stream.on('end', () => rest && lines.push(rest));
  }
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (child.exitCode !== null)
      throw new Error(`The API process exited (${child.exitCode}) before it was healthy:\n${lines.slice(-30).join('\n')}`);
    try {
      if ((await fetch(`${url}/api/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`The API process was not healthy within ${timeoutMs / 1000} s:\n${lines.slice(-30).join('\n')}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url,
    port,
    child,
    lines,
    output: () => lines.join('\n'),
    stop: async (graceMs = 15_000) => {
      if (child.exitCode !== null || child.signalCode !== null) return child.exitCode;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      const code = await exited;
      clearTimeout(timer);
      return code;
    },
  };
}

/** A tiny cookie-keeping client for one person, as a browser on the shop's own pages would be. */
export class Visitor {
  cookies = new Map<string, string>();
  constructor(readonly base: string) {}

  /** The Cookie header this visitor's browser would send now. */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async call(method: string, route: string, body?: unknown, headers: Record<string, string> = {}) {
    const response = await fetch(`${this.base}${route}`, {
      method,
      headers: {
        ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(this.cookies.size ? { cookie: this.cookieHeader() } : {}),
        ...headers,
      },
      body: body !== undefined ? JSON.stringify(body) : undefined,
      redirect: 'manual',
    });
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const eq = pair!.indexOf('=');
      const name = pair!.slice(0, eq);
      const value = pair!.slice(eq + 1);
      if (value) this.cookies.set(name, value);
      else this.cookies.delete(name);
    }
    const text = await response.text();
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read JSON answers loosely, as supertest's Response.body (typed any) does
    let json: any;
    try {
      json = text ? JSON.parse(text) : undefined;
    } catch {
      json = undefined;
    }
    return { status: response.status, headers: response.headers, body: json, text };
  }
}

// @ts-check
import { spawn } from 'node:child_process';
import { createServer } from 'node:net';

/**
 * Runs a command to completion with inherited output; rejects when it fails.
 * @param {string} command
 * @param {string[]} args
 * @param {import('node:child_process').SpawnOptions} [options]
 * @returns {Promise<void>}
 */
export function run(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) =>
      code === 0
        ? resolve()
        : reject(new Error(`${command} ${args.join(' ')} failed (${signal ?? `exit ${code}`})`)),
    );
  });
}

/**
 * Runs a command and returns its exit code (never rejects), for test suites.
 * @param {string} command
 * @param {string[]} args
 * @param {import('node:child_process').SpawnOptions} [options]
 * @returns {Promise<number>}
 */
export function runStatus(command, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', () => resolve(127));
    child.on('exit', (code) => resolve(code ?? 1));
  });
}

/**
 * Runs a command and captures its standard output.
 * @param {string} command
 * @param {string[]} args
 * @param {import('node:child_process').SpawnOptions} [options]
 * @returns {Promise<{ code: number, stdout: string, stderr: string }>}
 */
export function capture(command, args, options = {}) {
  return new Promise((resolve) => {
    const child = spawn(command, args, { ...options, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout?.on('data', (d) => (stdout += d));
    child.stderr?.on('data', (d) => (stderr += d));
    child.on('error', (err) => resolve({ code: 127, stdout, stderr: String(err) }));
    child.on('exit', (code) => resolve({ code: code ?? 1, stdout, stderr }));
  });
}

/**
 * A long-running child process (server), stopped with SIGTERM and, if it lingers, SIGKILL.
 * @param {string} name
 * @param {string} command
 * @param {string[]} args
 * @param {import('node:child_process').SpawnOptions} [options]
 */
export function startService(name, command, args, options = {}) {
  const child = spawn(command, args, { stdio: ['ignore', 'inherit', 'inherit'], ...options });
  let exited = false;
  const done = new Promise((resolve) =>
    child.on('exit', (code, signal) => {
      exited = true;
      resolve({ code, signal });
    }),
  );
  return {
    name,
    child,
    done,
    get running() {
      return !exited;
    },
    /** @param {number} [graceMs] */
    async stop(graceMs = 8000) {
      if (exited) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      await done;
      clearTimeout(timer);
    },
  };
}

/**
 * Waits until a URL answers (any HTTP status below 500 unless `okOnly`).
 * @param {string} url
 * @param {{ timeoutMs?: number, okOnly?: boolean, service?: { running: boolean } }} [options]
 */
export async function waitForHttp(url, { timeoutMs = 60000, okOnly = false, service } = {}) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (service && !service.running) throw new Error(`${url}: the process serving it has exited`);
    try {
      const res = await fetch(url);
      if (okOnly ? res.ok : res.status < 500 || res.status === 503) return res;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline)
      throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** @returns {Promise<number>} a TCP port free on 127.0.0.1 right now */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

/**
 * Whether something already listens on 127.0.0.1:port.
 * @param {number} port
 * @returns {Promise<boolean>}
 */
export function portInUse(port) {
  return new Promise((resolve) => {
    const server = createServer();
    server.once('error', () => resolve(true));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(false)));
  });
}

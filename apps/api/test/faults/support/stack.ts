import 'reflect-metadata';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../../../src/database/data-source.js';

/** The repository's root (this file is apps/api/test/faults/support/stack.ts). */
export const ROOT = fileURLToPath(new URL('../../../../../', import.meta.url)).replace(/\/$/, '');

/** What the fault tests use of scripts/lib (plain ESM with JSDoc types, loaded at run time). */
interface Service {
  child: { pid?: number; kill(signal: NodeJS.Signals): boolean };
  done: Promise<{ code: number | null; signal: string | null }>;
  readonly running: boolean;
  stop(graceMs?: number): Promise<void>;
}
interface Cluster {
  port: number;
  root: string;
  urlFor(db: string): string;
  stop(): Promise<void>;
}
interface ScriptsLib {
  freePort(): Promise<number>;
  startCluster(o: {
    home: string;
    port: number;
    key: string;
    credentialsFile: string;
  }): Promise<Cluster>;
  ensureDatabase(adminUrl: string, name: string): Promise<void>;
  startMailSink(o: {
    smtpPort: number;
    inboxPort: number;
    dir: string;
    quiet?: boolean;
  }): Promise<Service>;
  migrate(env: NodeJS.ProcessEnv): Promise<void>;
  startApi(env: NodeJS.ProcessEnv, o?: { quiet?: boolean }): Promise<Service>;
}

async function scriptsLib(): Promise<ScriptsLib> {
  // A computed specifier: TypeScript does not type-check the .mjs files (they check themselves).
  const load = (name: string) =>
    import(pathToFileURL(join(ROOT, 'scripts/lib', name)).href) as Promise<Partial<ScriptsLib>>;
  // One after another: jest's module loader trips over concurrent imports of shared modules.
  const proc = await load('proc.mjs');
  const postgres = await load('postgres.mjs');
  const stack = await load('stack.mjs');
  return { ...proc, ...postgres, ...stack } as ScriptsLib;
}

/** One API process of the fault stack, on its own port. */
export interface ApiProcess {
  readonly port: number;
  readonly base: string;
  readonly pid: number;
  readonly running: boolean;
  /** SIGKILL: no shutdown hooks, no draining, open transactions die with their connections. */
  kill(): Promise<void>;
  stop(): Promise<void>;
}

export interface FaultStack {
  /** A DataSource of the test's own to the stack's database (factories, checks). */
  dataSource: DataSource;
  databaseUrl: string;
  sinkUrl: string;
  startApi(env?: Record<string, string>): Promise<ApiProcess>;
  stopSink(): Promise<void>;
  startSink(): Promise<void>;
  stopPostgres(): Promise<void>;
  startPostgres(): Promise<void>;
  close(): Promise<void>;
}

const SESSION_SECRET = 'fault-tests-session-secret-long-enough-0123456789';

/**
 * A PostgreSQL cluster, a mail sink and API processes of the fault tests' own, on free ports and
 * in a temporary folder, so stopping, restarting and killing them never disturbs the shared test
 * cluster the e2e suite uses. Needs the API and the mail sink built (npm test builds them).
 */
export async function startFaultStack(name: string): Promise<FaultStack> {
  const lib = await scriptsLib();
  const work = mkdtempSync(join(tmpdir(), `skyhours-fault-${name}-`));
  chmodSync(work, 0o755); // the postgres user must reach the cluster's folder when run as root
  const pgHome = join(work, 'pg');
  const pgOptions = {
    home: pgHome,
    port: await lib.freePort(),
    key: pgHome,
    credentialsFile: join(work, 'pg-credentials.json'),
  };
  let cluster = await lib.startCluster(pgOptions);
  const clusterRoot = cluster.root;
  const dbName = 'skyhours_faults_test';
  await lib.ensureDatabase(cluster.urlFor('postgres'), dbName);
  const databaseUrl = cluster.urlFor(dbName);

  const smtpPort = await lib.freePort();
  const inboxPort = await lib.freePort();
  const sinkDir = join(work, 'mail');
  let sink: Service | null = await lib.startMailSink({
    smtpPort,
    inboxPort,
    dir: sinkDir,
    quiet: true,
  });

  const common: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET,
    MAIL_SMTP_HOST: '127.0.0.1',
    MAIL_SMTP_PORT: String(smtpPort),
    OUTBOX_POLL_MS: '200',
    WEB_DIST: '',
  };
  delete common.NODE_OPTIONS; // jest's --experimental-vm-modules is not the API's business
  await lib.migrate(common);

  const dataSource = new DataSource({
    ...dataSourceOptions(databaseUrl),
    extra: { max: 4, connectionTimeoutMillis: 5000 },
  });
  await dataSource.initialize();

  const apis: ApiProcess[] = [];
  return {
    dataSource,
    databaseUrl,
    sinkUrl: `http://127.0.0.1:${inboxPort}`,
    async startApi(env = {}) {
      const port = await lib.freePort();
      const service = await lib.startApi(
        { ...common, HOST: '127.0.0.1', PORT: String(port), ...env },
        { quiet: true },
      );
      const api: ApiProcess = {
        port,
        base: `http://127.0.0.1:${port}`,
        pid: service.child.pid ?? 0,
        get running() {
          return service.running;
        },
        async kill() {
          if (!service.running) return;
          service.child.kill('SIGKILL');
          await service.done;
        },
        stop: () => service.stop(),
      };
      apis.push(api);
      return api;
    },
    async stopSink() {
      await sink?.stop();
      sink = null;
    },
    async startSink() {
      sink ??= await lib.startMailSink({ smtpPort, inboxPort, dir: sinkDir, quiet: true });
    },
    stopPostgres: () => cluster.stop(),
    async startPostgres() {
      cluster = await lib.startCluster(pgOptions);
    },
    async close() {
      for (const api of apis) await api.stop().catch(() => undefined);
      await sink?.stop();
      await dataSource.destroy().catch(() => undefined);
      await cluster.stop();
      rmSync(clusterRoot, { recursive: true, force: true });
      rmSync(work, { recursive: true, force: true });
    },
  };
}

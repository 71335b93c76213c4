import type { TestProject } from 'vitest/node';
import { startApp, type RunningApp } from '../support/app-server';

let app: RunningApp | undefined;

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    dataDir: string;
    dbKind: string;
  }
}

// One built app per integration run, on PGlite by default or on the PostgreSQL server
// named by TEST_DATABASE_URL (scripts/with-postgres.sh starts one).
export async function setup(project: TestProject) {
  app = await startApp({ databaseUrl: process.env.TEST_DATABASE_URL || undefined });
  project.provide('baseUrl', app.url);
  project.provide('dataDir', app.dataDir);
  project.provide('dbKind', process.env.TEST_DATABASE_URL ? 'postgres' : 'pglite');
}

export async function teardown() {
  if (process.env.DEBUG_SERVER_LOG && app) console.log(app.log());
  await app?.stop();
}

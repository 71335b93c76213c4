import type { TestProject } from 'vitest/node';
import { startCluster, type Cluster } from '../support/cluster';

let cluster: Cluster | undefined;

declare module 'vitest' {
  export interface ProvidedContext {
    urlA: string;
    urlB: string;
    s3: { url: string; bucket: string; accessKeyId: string; secretAccessKey: string };
    /** The scratch directory the apps are given as UPLOADS_DIR: with S3 set nothing lands there. */
    localUploadsDir: string;
  }
}

// The cluster of `npm run demo:cluster` on spare ports (TEST_PORT_RANGE, if set, bounds them):
// one PostgreSQL server, one fake S3 bucket, two app processes A and B.
export async function setup(project: TestProject) {
  cluster = await startCluster({
    env: {
      // The suite signs up far more members from one address than any club would, and the soak
      // saves thousands of answers as one member.
      SIGNUPS_PER_CLIENT_PER_HOUR: '100000',
      ANSWER_QUOTA: '10000000',
    },
  });
  project.provide('urlA', cluster.a.url);
  project.provide('urlB', cluster.b.url);
  const { url, bucket, accessKeyId, secretAccessKey } = cluster.s3;
  project.provide('s3', { url, bucket, accessKeyId, secretAccessKey });
  project.provide('localUploadsDir', cluster.uploadsDir);
}

export async function teardown() {
  if (process.env.DEBUG_SERVER_LOG && cluster) console.log(`── A\n${cluster.a.log()}\n── B\n${cluster.b.log()}`);
  await cluster?.stop();
}

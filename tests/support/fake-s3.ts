import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

// A local S3-compatible server (s3rver) for tests and the cluster demo: a fresh directory, one
// bucket, a free port. It stands in for a hosted store; nothing leaves the machine.

export interface FakeS3 {
  url: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  directory: string;
  stop(): Promise<void>;
}

/** `port` 0 (the default) takes any free port. */
export async function startFakeS3(bucket = 'candlewise-photos', port = 0): Promise<FakeS3> {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port, silent: true, directory, configureBuckets: [{ name: bucket, configs: [] }] });
  const addr = await server.run();
  return {
    url: `http://127.0.0.1:${addr.port}`,
    bucket,
    // s3rver's fixed development credentials.
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    directory,
    async stop() {
      await server.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}

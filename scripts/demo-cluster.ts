import { startCluster, type Cluster } from '../tests/support/cluster';

// npm run demo:cluster: a throwaway PostgreSQL server, the fake S3 server and two app processes
// (PORT_A, default 3001; PORT_B, default 3002) on them, migrated and seeded with the demo club.
// Ctrl-C or SIGTERM stops everything and removes the temporary directories. Needs a build first
// (`npm run build`), as `npm start` does.

function port(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 65535) {
    console.error(`✖ ${name} must be a port number (1–65535), not ${JSON.stringify(raw)}`);
    process.exit(2);
  }
  return n;
}

async function main() {
  const ports: [number, number] = [port('PORT_A', 3001), port('PORT_B', 3002)];
  if (ports[0] === ports[1]) {
    console.error('✖ PORT_A and PORT_B must differ');
    process.exit(2);
  }
  const prefix = (name: string, chunk: string) =>
    chunk
      .split('\n')
      .filter((l) => l.trim())
      .map((l) => `[${name}] ${l}`)
      .join('\n');
  const starting: Promise<Cluster> = startCluster({
    ports,
    detached: true,
    onStep: (label) => console.log(`▶ ${label}`),
    onOutput: (name, chunk) => {
      const text = prefix(name, chunk);
      if (text) console.log(text);
    },
  });

  let stopping = false;
  const stop = async (code: number) => {
    if (stopping) return;
    stopping = true;
    console.log('\n▶ stopping both apps, the fake S3 server and PostgreSQL');
    // A signal during start-up waits for it to finish (or fail, having stopped what it started).
    const cluster = await starting.catch(() => undefined);
    await cluster?.stop();
    console.log('✔ stopped; temporary directories removed');
    process.exit(code);
  };
  for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => void stop(0));

  let cluster: Cluster;
  try {
    cluster = await starting;
  } catch (e) {
    if (stopping) return;
    console.error(`✖ ${(e as Error).message}`);
    // startCluster has already stopped what it started.
    process.exit(1);
  }
  if (stopping) return;
  console.log(`
✔ Candlewise cluster running
  app A: ${cluster.a.url}
  app B: ${cluster.b.url}
  PostgreSQL ${cluster.postgres.version}: ${cluster.postgres.url}
  fake S3: ${cluster.s3.url} (bucket ${cluster.s3.bucket})
  demo accounts: see README.md, password candlewise-demo
  Ctrl-C stops everything.`);
  for (const app of [cluster.a, cluster.b]) {
    app.process.once('exit', (code, signal) => {
      if (stopping) return;
      console.error(`✖ app ${app.name} exited (${signal ?? code}); stopping the rest`);
      void stop(1);
    });
  }
}

void main();

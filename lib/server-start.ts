// Open the database at start (migrations apply here, so the first request does not pay for
// them) and, in development, demo and tests, start the local SMTP fake.
export async function startServer() {
  // First, before any request: the client's address comes from the socket, not its headers.
  const { installPeerStamp } = await import('@/lib/http/client-address');
  installPeerStamp();
  const { getDb, getDbHandle } = await import('@/db/client');
  const { masterSecret } = await import('@/lib/auth/secret');
  try {
    // Refuse to start without a usable secret, rather than on the first sign-in.
    masterSecret();
    await getDb();
  } catch (e) {
    console.error(`[candlewise] ${(e as Error).message}`);
    process.exit(1);
  }
  // PostgreSQL: hear the other server processes' writes, so the caches can be shared safely
  // (lib/data/invalidation.ts; a no-op on PGlite). It retries by itself until it is live.
  const { startInvalidationListener } = await import('@/lib/data/invalidation');
  startInvalidationListener(await getDbHandle());
  if (process.env.MAIL_FAKE === '1') {
    const { startFakeSmtp } = await import('@/lib/mail/fake-smtp');
    const port = Number(process.env.SMTP_FAKE_PORT ?? 2525);
    await startFakeSmtp(port);
    console.log(`[candlewise] mail fake listening on smtp://127.0.0.1:${port}`);
  }
  // The job queue's worker (weekly reminders) runs in this process, on the same database.
  const { startWorker } = await import('@/lib/queue/worker');
  await startWorker();
}

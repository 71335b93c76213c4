// Runs once when the server starts. The Node-only work lives in its own module so the
// edge bundle never sees it.
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { startServer } = await import('./lib/server-start');
    await startServer();
  }
}

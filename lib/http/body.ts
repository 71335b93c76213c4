import { AppError } from '@/lib/errors';

/** The cap for an ordinary JSON or form body. Photo uploads and imports pass their own. */
export const DEFAULT_MAX_BODY_BYTES = 1_000_000;

/**
 * Read a request body with a byte cap: a declared Content-Length over the cap is refused before
 * a byte is read, and the bytes are counted while streaming, so a body without (or lying about)
 * its length is cut off at the cap. Either way the rest is never read: 413.
 */
export async function readBodyCapped(
  req: Request,
  maxBytes = DEFAULT_MAX_BODY_BYTES,
  say: { subject?: string; field?: string; message?: string } = {},
): Promise<Uint8Array> {
  const message = say.message ?? `The request body is larger than ${maxBytes} bytes.`;
  const tooLarge = () => new AppError(`payload_too_large:${say.subject ?? 'body'}`, message, say.field ? { [say.field]: [message] } : undefined);
  const declared = req.headers.get('content-length');
  if (declared !== null && /^\d+$/.test(declared.trim()) && Number(declared) > maxBytes) {
    await req.body?.cancel().catch(() => {});
    throw tooLarge();
  }
  const reader = req.body?.getReader();
  if (!reader) return new Uint8Array(0);
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => {});
      throw tooLarge();
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

import 'server-only';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { getDb } from '@/db/client';
import { outboxMessages } from '@/db/schema';

const g = globalThis as unknown as { __cwFakeSmtp?: SMTPServer };
const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

/**
 * A local SMTP server for development, demo and tests: it accepts every message on 127.0.0.1
 * and stores it in the outbox table, where administrators read it. It never relays anything.
 * A message whose Message-ID is already stored (the same mail handed over again after a crash
 * between the hand-over and its bookkeeping) is accepted and not stored twice.
 */
export async function startFakeSmtp(port: number): Promise<SMTPServer> {
  if (g.__cwFakeSmtp) return g.__cwFakeSmtp;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks).toString('utf8');
          const parsed = await simpleParser(raw);
          const db = await getDb();
          await db
            .insert(outboxMessages)
            .values({
              envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
              envelopeTo: session.envelope.rcptTo.map((r) => r.address),
              subject: parsed.subject ?? '',
              text: parsed.text ?? null,
              html: typeof parsed.html === 'string' ? parsed.html : null,
              raw,
              messageId: parsed.messageId ?? null,
            })
            .onConflictDoNothing({ target: outboxMessages.messageId });
          callback();
        } catch (e) {
          callback(e as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  g.__cwFakeSmtp = server;
  return server;
}

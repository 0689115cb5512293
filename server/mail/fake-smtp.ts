import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/client';
import { outbox } from '../db/schema';
import { newId } from '../auth/tokens';

const MAX_MESSAGE_BYTES = 1024 * 1024;

function addresses(field: AddressObject | AddressObject[] | undefined): string {
  if (!field) return '';
  return (Array.isArray(field) ? field : [field]).map((a) => a.text).join(', ');
}

/**
 * A local SMTP server on loopback that accepts every message and stores it in the outbox table,
 * so e-mail flows can be followed in development and tests without any outside service.
 * The message is in the table before the server answers 250, so a sender that awaited the send
 * can read it at once.
 */
export async function startFakeSmtp(db: Db, port: number, host = '127.0.0.1'): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    banner: 'Spoolbook local mail catcher',
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address).join(', ');
          await db.insert(outbox).values({
            id: newId(),
            from: addresses(parsed.from) || (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: addresses(parsed.to) || envelopeTo,
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            raw: raw.toString('utf8'),
            headers: Object.fromEntries([...parsed.headers.entries()].map(([k, v]) => [k, typeof v === 'string' ? v : JSON.stringify(v)])),
          });
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
  const address = server.server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return { port: actualPort, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import type { Db } from '../db/client';
import { devMail } from '../db/schema';

export interface MailSink {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 1024 * 1024;

/**
 * A development SMTP server on loopback that accepts every message and stores it in the
 * `dev_mail` table (shown at /dev/mailbox). It answers DATA only after the row is written, so a
 * send that resolved is already readable.
 */
export async function startMailSink(db: Db): Promise<MailSink> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: MAX_MESSAGE_BYTES,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) =>
          db.insert(devMail).values({
            mailFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            rcptTo: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
          }),
        )
        .then(() => callback(), (err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  server.on('error', (err) => console.error('mail sink:', err.message));
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

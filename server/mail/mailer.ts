import nodemailer from 'nodemailer';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { startMailSink } from './sink';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mail {
  send(mail: OutgoingMail): Promise<void>;
  /** True when messages go to the local sink (and /dev/mailbox shows them). */
  readonly toSink: boolean;
  close(): Promise<void>;
}

/**
 * Mail through nodemailer over SMTP: to SMTP_HOST when configured, else (development and tests)
 * to a local sink started here. Production without SMTP_HOST sends nothing (returns null).
 */
export async function startMail(config: Config, database: Database): Promise<Mail | null> {
  if (config.SMTP_HOST) {
    const transport = nodemailer.createTransport({
      host: config.SMTP_HOST,
      port: config.SMTP_PORT,
      secure: config.SMTP_SECURE,
      ...(config.SMTP_USER ? { auth: { user: config.SMTP_USER, pass: config.SMTP_PASS ?? '' } } : {}),
    });
    return {
      toSink: false,
      send: async (m) => { await transport.sendMail({ from: config.SMTP_FROM, ...m }); },
      close: async () => transport.close(),
    };
  }
  if (config.NODE_ENV === 'production') return null;
  const sink = await startMailSink(database.db);
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port: sink.port, secure: false, ignoreTLS: true });
  return {
    toSink: true,
    send: async (m) => { await transport.sendMail({ from: config.SMTP_FROM, ...m }); },
    close: async () => {
      transport.close();
      await sink.close();
    },
  };
}

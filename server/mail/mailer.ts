import nodemailer from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/** Sends through SMTP: a real relay in production, the local fake in development and tests. */
export function createMailer(smtpUrl: string, from: string): Mailer {
  // The local fake speaks plain SMTP on loopback; a real relay negotiates TLS as its URL says.
  const url = new URL(smtpUrl);
  const local = url.protocol === 'smtp:' && (url.hostname === '127.0.0.1' || url.hostname === 'localhost');
  const transport = local
    ? nodemailer.createTransport({ host: url.hostname, port: Number(url.port || 25), secure: false, ignoreTLS: true })
    : nodemailer.createTransport(smtpUrl);
  return {
    async send(message) {
      await transport.sendMail({ from, ...message });
    },
    close() {
      transport.close();
    },
  };
}

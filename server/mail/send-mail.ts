import nodemailer, { type Transporter } from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  html: string;
  text: string;
  headers?: Record<string, string>;
  /** Inline images referenced from the HTML as `cid:<cid>`. */
  attachments?: { filename: string; content: Buffer; cid: string; contentType: string }[];
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** A nodemailer transport to `smtpUrl` (a relay in production, the local catcher otherwise). */
export function createMailer(smtpUrl: string, fromAddress: string): Mailer {
  const url = new URL(smtpUrl);
  const local = url.hostname === '127.0.0.1' || url.hostname === 'localhost';
  const transport: Transporter = nodemailer.createTransport({
    // Reuse a few connections instead of one handshake per message.
    pool: true,
    maxConnections: 4,
    host: url.hostname,
    port: url.port ? Number(url.port) : url.protocol === 'smtps:' ? 465 : 587,
    secure: url.protocol === 'smtps:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    // The local catcher speaks plain SMTP on loopback; a relay is expected to offer STARTTLS.
    ignoreTLS: local,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: fromAddress, ...mail });
    },
    close: () => transport.close(),
  };
}

import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

export interface CaughtMessage {
  from: string;
  to: string;
  subject: string;
  html: string | null;
  text: string | null;
  headers: Record<string, string>;
}

export interface MailCatcher {
  port: number;
  /** The SMTP URL for a nodemailer transport that delivers to this catcher. */
  url: string;
  close(): Promise<void>;
}

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

/**
 * A local SMTP server on 127.0.0.1 that accepts every message and hands it, parsed, to
 * `onMessage`. Used when no SMTP_URL is configured (development, demo and tests).
 */
export async function startMailCatcher(onMessage: (message: CaughtMessage) => Promise<void>, port = 0): Promise<MailCatcher> {
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    size: 20 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const headers: Record<string, string> = {};
          for (const line of parsed.headerLines) {
            const separator = line.line.indexOf(':');
            headers[line.key] = separator >= 0 ? line.line.slice(separator + 1).trim() : line.line;
          }
          await onMessage({
            from: addressText(parsed.from),
            to: addressText(parsed.to),
            subject: parsed.subject ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            text: parsed.text ?? null,
            headers,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return {
    port: actualPort,
    url: `smtp://127.0.0.1:${actualPort}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

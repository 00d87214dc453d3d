import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import type { Db } from '@/db/connection';
import { capturedEmails } from '@/db/schema';

/**
 * The local SMTP server used when no SMTP_URL is set: it listens on 127.0.0.1 only, accepts any credentials
 * (next to nothing can reach it) and stores every message in captured_emails, which the admin outbox shows.
 */
export async function startCaptureServer(db: Db, port = 0): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS'],
    allowInsecureAuth: true,
    authOptional: true,
    logger: false,
    size: 2 * 1024 * 1024,
    onAuth(_auth, _session, callback) {
      callback(null, { user: 'trailbench' });
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address).join(', ');
          const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          db.insert(capturedEmails)
            .values({
              fromAddress: from,
              toAddress: to,
              subject: mail.subject ?? '(no subject)',
              textBody: mail.text ?? '',
              htmlBody: typeof mail.html === 'string' ? mail.html : null,
            })
            .run();
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = (server as unknown as { server: { address(): AddressInfo } }).server.address();
  return {
    port: address.port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

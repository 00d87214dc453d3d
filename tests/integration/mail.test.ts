import nodemailer from 'nodemailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDb } from '@/db/test-db';
import type { Db } from '@/db/connection';
import { listCapturedEmails } from '@/db/outbox';
import { startCaptureServer } from '@/lib/mail/capture-server';

let db: Db;
let server: Awaited<ReturnType<typeof startCaptureServer>>;

beforeAll(async () => {
  db = createTestDb().db;
  server = await startCaptureServer(db);
});
afterAll(() => server.close());

describe('local SMTP capture server', () => {
  it('listens on loopback and stores every message for the admin outbox', async () => {
    expect(server.port).toBeGreaterThan(0);
    // The same transport options the app uses: credentials always sent, STARTTLS ignored.
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: server.port, secure: false, ignoreTLS: true, auth: { user: 'any', pass: 'any' } });
    await transport.sendMail({ from: 'Trailbench <no-reply@trailbench.localhost>', to: 'ada@example.org', subject: 'Your sign-in link', text: 'Open http://localhost:3000/signin/confirm?token=abc' });
    const [message] = listCapturedEmails(db);
    expect(message).toMatchObject({ toAddress: 'ada@example.org', fromAddress: 'no-reply@trailbench.localhost', subject: 'Your sign-in link' });
    expect(message?.textBody).toContain('/signin/confirm?token=abc');
  });
});

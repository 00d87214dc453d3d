import nodemailer, { type Transporter } from 'nodemailer';

const store = globalThis as unknown as { trailbenchMailer?: Transporter; trailbenchCapturePort?: number };

export const MAIL_FROM = process.env.MAIL_FROM ?? 'Trailbench <no-reply@trailbench.localhost>';

/** Records the port of the local capture server (set at start-up by instrumentation.ts). */
export function useCaptureServer(port: number): void {
  store.trailbenchCapturePort = port;
  store.trailbenchMailer = undefined;
}

function transport(): Transporter {
  if (store.trailbenchMailer) return store.trailbenchMailer;
  if (process.env.SMTP_URL) {
    store.trailbenchMailer = nodemailer.createTransport(process.env.SMTP_URL);
  } else {
    const port = store.trailbenchCapturePort ?? Number(process.env.CAPTURE_SMTP_PORT ?? 0);
    if (!port) throw new Error('No SMTP_URL is set and the local capture server has not started.');
    store.trailbenchMailer = nodemailer.createTransport({
      host: '127.0.0.1',
      port,
      secure: false,
      ignoreTLS: true,
      auth: { user: 'trailbench', pass: 'local-capture' },
    });
  }
  return store.trailbenchMailer;
}

export async function sendMail(message: { to: string; subject: string; text: string; html?: string }): Promise<void> {
  await transport().sendMail({ from: MAIL_FROM, ...message });
}

// The one nodemailer transport, built from SMTP_URL as a URL string (the object form with empty credentials
// makes nodemailer try AUTH PLAIN and fail). Reused across dev reloads like the database client.
import nodemailer, { type Transporter } from 'nodemailer';
import { getEnv } from '@/lib/env';

const globalForMail = globalThis as unknown as { fluxfolioMail?: { url: string; transport: Transporter } };

/**
 * The shared SMTP transport for SMTP_URL (default `smtp://127.0.0.1:2525?ignoreTLS=true`, the local fake server).
 * A changed SMTP_URL (tests) gets a new transport.
 *
 * @example
 * await mailTransport().sendMail({ from, to, subject, text });
 * @see https://nodemailer.com/smtp/ (URL options such as `ignoreTLS`)
 */
export function mailTransport(): Transporter {
  const url = getEnv().SMTP_URL;
  const cached = globalForMail.fluxfolioMail;
  if (cached && cached.url === url) return cached.transport;
  cached?.transport.close();
  const transport = nodemailer.createTransport(url);
  globalForMail.fluxfolioMail = { url, transport };
  return transport;
}

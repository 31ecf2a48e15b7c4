// Send one e-mail from MAIL_FROM through the shared SMTP transport; used by sign-in links and invitations.
// Validates the message with zod first, so a bad address fails with a clear error before any network call.
import { z } from 'zod';
import { getEnv } from '@/lib/env';
import { mailTransport } from './transport';

export const outgoingMailSchema = z.object({
  to: z.email('to: must be an e-mail address').max(254),
  subject: z.string().min(1, 'subject: required').max(300),
  text: z.string().min(1, 'text: required'),
  html: z.string().optional(),
});
export type OutgoingMail = z.infer<typeof outgoingMailSchema>;

/**
 * Send an e-mail (plain text, optionally with an HTML part).
 *
 * @param mail - recipient, subject, text and optional HTML
 * @returns the SMTP message id
 * @throws ZodError for a malformed message; the transport's error when the SMTP server refuses or is down
 * @example
 * await sendMail({ to: 'someone@example.org', subject: 'Hello', text: 'Hi there' });
 */
export async function sendMail(mail: OutgoingMail): Promise<{ messageId: string }> {
  const { to, subject, text, html } = outgoingMailSchema.parse(mail);
  const info = await mailTransport().sendMail({ from: getEnv().MAIL_FROM, to, subject, text, html });
  return { messageId: String(info.messageId) };
}

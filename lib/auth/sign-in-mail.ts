// The wording of the sign-in e-mail carrying the one-time link. Only known addresses get it; an address without an
// account gets no mail at all, and the sign-in form answers the same either way.
import { escapeHtml } from '@/lib/text/escape-html';

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function paragraph(text: string): string {
  return `<p style="margin:0 0 14px;font:15px/1.5 system-ui,sans-serif;color:#1e293b">${text}</p>`;
}

/** The mail carrying a one-time sign-in link. `minutes` is how long the link works. */
export function signInLinkMail({ url, minutes, host }: { url: string; minutes: number; host: string }): MailContent {
  const subject = 'Your Fluxfolio sign-in link';
  const text = [
    'Someone (hopefully you) asked to sign in to Fluxfolio with this address.',
    '',
    `Open this link within ${minutes} minutes to sign in; it works once:`,
    url,
    '',
    `If you did not ask for it, ignore this message: nobody can sign in without the link. (${host})`,
  ].join('\n');
  const html = [
    paragraph('Someone (hopefully you) asked to sign in to Fluxfolio with this address.'),
    paragraph(
      `<a href="${escapeHtml(url)}" style="display:inline-block;padding:10px 16px;border-radius:8px;background:#4338ca;color:#fff;text-decoration:none;font-weight:600">Sign in to Fluxfolio</a>`,
    ),
    paragraph(`The link works once, within ${minutes} minutes. If you did not ask for it, ignore this message.`),
    paragraph(`<span style="color:#64748b">${escapeHtml(host)}</span>`),
  ].join('\n');
  return { subject, text, html };
}

// The wording of the invitation e-mail an owner's invite sends: who invites, to which manuscript, in which role,
// and the one link that accepts (signing the invitee up when they have no account yet).
import type { MemberRole } from '@/db/schema';
import { ROLE_LABELS, ROLE_RIGHTS_FOR_YOU } from '@/lib/authz/roles';
import type { MailContent } from '@/lib/auth/sign-in-mail';
import { escapeHtml } from '@/lib/text/escape-html';

function paragraph(html: string): string {
  return `<p style="margin:0 0 14px;font:15px/1.5 system-ui,sans-serif;color:#1e293b">${html}</p>`;
}

/**
 * @param url - the absolute acceptance link, `${APP_URL}/invite/${token}`
 * @param days - how long the link stays valid
 */
export function invitationMail({
  url,
  inviterName,
  manuscriptTitle,
  role,
  days,
}: {
  url: string;
  inviterName: string;
  manuscriptTitle: string;
  role: MemberRole;
  days: number;
}): MailContent {
  const label = ROLE_LABELS[role].toLowerCase();
  const subject = `${inviterName} invites you to “${manuscriptTitle}” on Fluxfolio`;
  const text = [
    `${inviterName} invites you to join the manuscript “${manuscriptTitle}” as ${label}.`,
    `As ${label}, you ${ROLE_RIGHTS_FOR_YOU[role]}.`,
    '',
    `Accept within ${days} days (if you have no Fluxfolio account yet, the link creates one):`,
    url,
  ].join('\n');
  const html = [
    paragraph(
      `${escapeHtml(inviterName)} invites you to join the manuscript <strong>${escapeHtml(manuscriptTitle)}</strong> as ${label}.`,
    ),
    paragraph(`<span style="color:#475569">As ${label}, you ${escapeHtml(ROLE_RIGHTS_FOR_YOU[role])}.</span>`),
    paragraph(
      `<a href="${escapeHtml(url)}" style="display:inline-block;padding:10px 16px;border-radius:8px;background:#4338ca;color:#fff;text-decoration:none;font-weight:600">Accept the invitation</a>`,
    ),
    paragraph(`The link stays valid for ${days} days. If you have no Fluxfolio account yet, it creates one.`),
    paragraph(`<span style="color:#64748b;word-break:break-all">${escapeHtml(url)}</span>`),
  ].join('\n');
  return { subject, text, html };
}

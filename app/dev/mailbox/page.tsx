// Developer mailbox: the messages the local fake SMTP server received (MAIL_DIR), newest first, with clickable
// links. Off unless FLUXFOLIO_DEV_MAILBOX=1 (or `next dev`); even then only site admins see it, everyone else a 404.
import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getEnv } from '@/lib/env';
import { listMessages } from '@/lib/mail/mailbox';
import { EmptyState } from '../../_components/empty-state';
import { devMailboxVisible } from './enabled';
import { MailText } from './mail-text';

export const metadata: Metadata = { title: 'Dev mailbox', robots: { index: false } };
export const dynamic = 'force-dynamic';

const MAX_SHOWN = 50;

export default async function DevMailboxPage() {
  if (!(await devMailboxVisible())) notFound();
  const messages = (await listMessages()).slice(0, MAX_SHOWN);
  return (
    <div className="space-y-6">
      <div>
        <p className="text-xs font-semibold tracking-wide text-phase-700 uppercase">Development only</p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight text-slate-900">Mailbox</h1>
        <p className="mt-1 text-sm text-slate-600">
          What the local SMTP server received ({getEnv().MAIL_DIR}), newest first; at most {MAX_SHOWN}.
        </p>
      </div>
      {messages.length === 0 ? (
        <EmptyState title="No messages yet">Ask for a sign-in link or send an invitation, then reload.</EmptyState>
      ) : (
        <ol className="space-y-4" data-testid="dev-mailbox">
          {messages.map((message) => (
            <li key={message.file} className="rounded-xl bg-white p-5 shadow-sm ring-1 ring-slate-200">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="font-semibold text-slate-900">{message.subject}</h2>
                <time className="text-xs text-slate-500" dateTime={message.receivedAt.toISOString()}>
                  {message.receivedAt.toISOString().replace('T', ' ').slice(0, 19)} UTC
                </time>
              </div>
              <p className="mt-1 text-xs text-slate-600">
                To {message.to.join(', ')} · from {message.from}
              </p>
              <MailText text={message.text} />
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}

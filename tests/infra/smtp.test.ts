// The fake SMTP server (scripts/smtp.mjs) end to end: our nodemailer transport sends, the server stores JSON + .eml,
// and the mailbox reader finds the message by recipient; files are owner-only (0600, folder 0700); bad options exit 2.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chmodSync, existsSync, mkdtempSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listMessages } from '@/lib/mail/mailbox';
import { sendMail } from '@/lib/mail/send-mail';
import { linkIn, waitForMailTo } from '../helpers/mail';

const dir = mkdtempSync(path.join(tmpdir(), 'ff-smtptest-'));
chmodSync(dir, 0o755);
let server: ChildProcess;
let port: number;
const savedSmtpUrl = process.env.SMTP_URL;

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port: p } = probe.address() as { port: number };
      probe.close(() => resolve(p));
    });
  });
}

beforeAll(async () => {
  port = await freePort();
  server = spawn('node', ['scripts/smtp.mjs', '--port', String(port), '--dir', dir], { stdio: ['ignore', 'pipe', 'pipe'] });
  await new Promise<void>((resolve, reject) => {
    let output = '';
    server.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('listening on')) resolve();
    });
    server.once('exit', (code) => reject(new Error(`smtp.mjs exited with ${code}: ${output}`)));
  });
  process.env.SMTP_URL = `smtp://127.0.0.1:${port}?ignoreTLS=true`;
});

afterAll(async () => {
  if (savedSmtpUrl === undefined) delete process.env.SMTP_URL;
  else process.env.SMTP_URL = savedSmtpUrl;
  if (server && server.exitCode === null) {
    const exited = new Promise((resolve) => server.once('exit', resolve));
    server.kill('SIGTERM');
    await exited;
  }
  rmSync(dir, { recursive: true, force: true });
});

describe('fake SMTP round trip', () => {
  it('stores a message sent through our transport, readable by recipient', async () => {
    const since = new Date();
    const link = 'http://127.0.0.1:3100/invite/abc123';
    await sendMail({
      to: 'Round.Trip@Example.org',
      subject: 'Flux tube ü — test',
      text: `Open ${link} to join.`,
      html: `<p>Open <a href="${link}">the link</a></p>`,
    });
    const message = await waitForMailTo('round.trip@example.org', { since, dir, timeoutMs: 10_000 });
    expect(message.subject).toBe('Flux tube ü — test');
    expect(message.to.map((to) => to.toLowerCase())).toEqual(['round.trip@example.org']);
    expect(message.from).toMatch(/Fluxfolio/);
    expect(message.html).toContain('<a href=');
    expect(linkIn(message, '/invite/')).toBe(link);
    expect(existsSync(path.join(dir, message.file.replace(/\.json$/, '.eml')))).toBe(true);
  });

  it('keeps the mailbox private: the folder becomes 0700 and every stored file is 0600', async () => {
    const since = new Date();
    await sendMail({ to: 'private@example.org', subject: 'a sign-in link', text: 'http://127.0.0.1:3100/api/auth/callback/email?token=t' });
    const message = await waitForMailTo('private@example.org', { since, dir, timeoutMs: 10_000 });
    // The folder was created 0755 by this test before the server started: the server tightened it.
    expect(statSync(dir).mode & 0o777).toBe(0o700);
    expect(statSync(path.join(dir, message.file)).mode & 0o777).toBe(0o600);
    expect(statSync(path.join(dir, message.file.replace(/\.json$/, '.eml'))).mode & 0o777).toBe(0o600);
  });

  it('lists newest first and skips files that are not messages', async () => {
    writeFileSync(path.join(dir, 'zzz-not-a-message.json'), '{"hello": 1}');
    writeFileSync(path.join(dir, 'zzz-broken.json'), '{');
    await sendMail({ to: 'second@example.org', subject: 'second', text: 'two' });
    const second = await waitForMailTo('second@example.org', { dir });
    const messages = await listMessages(dir);
    expect(messages.map((m) => m.subject)).toEqual(['second', 'a sign-in link', 'Flux tube ü — test']);
    expect(second.receivedAt.getTime()).toBeGreaterThanOrEqual(messages[1].receivedAt.getTime());
  });

  it('refuses a malformed message before sending and times out clearly when nothing arrives', async () => {
    await expect(sendMail({ to: 'not an address', subject: 's', text: 't' })).rejects.toThrow(/e-mail address/);
    await expect(waitForMailTo('nobody@example.org', { dir, timeoutMs: 300 })).rejects.toThrow(/no mail to nobody@example.org/);
  });

  it('reads an empty list from a missing mailbox', async () => {
    expect(await listMessages(path.join(dir, 'missing'))).toEqual([]);
  });

  it('exits with 2 on a bad option', () => {
    const bad = spawnSync('node', ['scripts/smtp.mjs', '--port', 'seventy'], { encoding: 'utf8' });
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--port must be an integer/);
    expect(spawnSync('node', ['scripts/smtp.mjs', '--frobnicate'], { encoding: 'utf8' }).status).toBe(2);
  });
});

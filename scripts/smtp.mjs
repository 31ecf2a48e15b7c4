// Local fake SMTP server for development and tests: accepts every message on 127.0.0.1 and stores it in MAIL_DIR
// as <timestamp>-<id>.json ({id,from,to,subject,text,html,date}) plus the raw .eml. Never relays anything.
// Sign-in links are secrets: the folder is kept 0700 and every file is written 0600 (readable by this user only).
// Usage: node scripts/smtp.mjs [--host 127.0.0.1] [--port 2525] [--dir .data/mail]   (env: SMTP_HOST, SMTP_PORT, MAIL_DIR)
import { randomBytes } from 'node:crypto';
import { chmodSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;
/** Owner-only permissions: messages carry one-time sign-in links. */
const FILE_MODE = 0o600;
const DIR_MODE = 0o700;

function fail(message) {
  console.error(`[smtp] ${message}`);
  process.exit(2);
}

function readOptions() {
  let values;
  try {
    ({ values } = parseArgs({
      options: { host: { type: 'string' }, port: { type: 'string' }, dir: { type: 'string' } },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    fail(`${error.message}\nusage: node scripts/smtp.mjs [--host 127.0.0.1] [--port 2525] [--dir .data/mail]`);
  }
  const host = values.host || process.env.SMTP_HOST || '127.0.0.1';
  const portText = values.port || process.env.SMTP_PORT || '2525';
  const port = Number(portText);
  if (!Number.isInteger(port) || port < 1 || port > 65535) fail(`--port must be an integer 1..65535, got '${portText}'`);
  const dir = path.resolve(values.dir || process.env.MAIL_DIR || '.data/mail');
  return { host, port, dir };
}

let sequence = 0;
/** A file-name stem that sorts by arrival time: ISO time without ':' and '.', a counter, a random id. */
function nextStem(id) {
  sequence = (sequence + 1) % 1_000_000;
  const time = new Date().toISOString().replace(/[:.]/g, '-');
  return `${time}-${String(sequence).padStart(6, '0')}-${id}`;
}

/** Write through a temporary name (mode 0600), so that readers never see half a file. */
function writeAtomically(file, content) {
  const tmp = `${file}.tmp`;
  rmSync(tmp, { force: true }); // a stale file would keep its old mode
  writeFileSync(tmp, content, { mode: FILE_MODE, flag: 'wx' });
  chmodSync(tmp, FILE_MODE); // whatever the umask
  renameSync(tmp, file);
}

function store(dir, raw, parsed, envelope) {
  const id = randomBytes(6).toString('hex');
  const stem = nextStem(id);
  const message = {
    id,
    from: parsed.from?.text || envelope.mailFrom?.address || '',
    to: envelope.rcptTo.map((r) => r.address),
    subject: parsed.subject || '',
    text: parsed.text || '',
    html: typeof parsed.html === 'string' ? parsed.html : '',
    date: (parsed.date || new Date()).toISOString(),
  };
  writeAtomically(path.join(dir, `${stem}.eml`), raw);
  writeAtomically(path.join(dir, `${stem}.json`), JSON.stringify(message, null, 2));
  return message;
}

const { host, port, dir } = readOptions();
mkdirSync(dir, { recursive: true, mode: DIR_MODE });
chmodSync(dir, DIR_MODE); // also when the folder already existed

const server = new SMTPServer({
  name: 'fluxfolio-dev-smtp',
  authOptional: true,
  disabledCommands: ['STARTTLS', 'AUTH'],
  size: MAX_MESSAGE_BYTES,
  logger: false,
  onData(stream, session, callback) {
    const chunks = [];
    stream.on('data', (chunk) => chunks.push(chunk));
    stream.on('error', callback);
    stream.on('end', async () => {
      if (stream.sizeExceeded) return callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
      try {
        const raw = Buffer.concat(chunks);
        const message = store(dir, raw, await simpleParser(raw), session.envelope);
        console.log(`[smtp] ${message.to.join(', ')}: ${message.subject}`);
        callback();
      } catch (error) {
        console.error(`[smtp] could not store a message: ${error.message}`);
        callback(Object.assign(new Error('Could not store the message'), { responseCode: 451 }));
      }
    });
  },
});

server.on('error', (error) => {
  console.error(`[smtp] ${error.code === 'EADDRINUSE' ? `port ${port} on ${host} is already in use` : error.message}`);
  process.exit(1);
});

server.listen(port, host, () => console.log(`[smtp] listening on ${host}:${port}, saving mail to ${dir}`));

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => server.close(() => process.exit(0)));
}

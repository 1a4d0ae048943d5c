import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

/**
 * A local stand-in for a mail relay: accepts SMTP on loopback (any login or
 * none, no TLS), keeps every message in memory and shows them over HTTP.
 * The same fake serves `npm start` and the tests, reached through its ports.
 */

export interface MailAttachment {
  filename: string;
  contentType: string;
  size: number;
  content: Buffer;
}

export interface Message {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: MailAttachment[];
  date: string;
}

export interface MailFake {
  smtpPort: number;
  httpUrl: string;
  messages(): Message[];
  waitForMessage(pred: (m: Message) => boolean, timeoutMs?: number): Promise<Message>;
  clear(): void;
  close(): Promise<void>;
}

export interface MailFakeOptions {
  host?: string;
  smtpPort?: number;
  httpPort?: number;
}

type Waiter = { pred: (m: Message) => boolean; resolve: (m: Message) => void };

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  if (!value) return [];
  const list = Array.isArray(value) ? value : [value];
  return list.flatMap((a) => a.value.map((v) => v.address ?? '').filter(Boolean));
}

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

/** JSON form of a message: attachment bodies are left out, fetched by their own URL. */
function summary(m: Message) {
  return {
    ...m,
    attachments: m.attachments.map((a, index) => ({
      index,
      filename: a.filename,
      contentType: a.contentType,
      size: a.size,
      url: `/api/messages/${m.id}/attachments/${index}`,
    })),
  };
}

const pageStyle = `body{font-family:system-ui,sans-serif;margin:2rem;color:#2A2320;background:#F7F3EC}
table{border-collapse:collapse;width:100%;background:#FFFDF9}th,td{text-align:left;padding:.4rem .6rem;border-bottom:1px solid #E4DBCF}
a{color:#B5562B}pre{white-space:pre-wrap;background:#FFFDF9;padding:1rem;border:1px solid #E4DBCF}`;

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title><style>${pageStyle}</style></head><body>${body}</body></html>`;
}

function mailboxPage(list: Message[]): string {
  const rows = list
    .map((m) => `<tr><td>${escapeHtml(new Date(m.date).toLocaleString())}</td><td>${escapeHtml(m.from)}</td><td>${escapeHtml(m.to.join(', '))}</td><td><a href="/messages/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td><td>${m.attachments.length || ''}</td></tr>`)
    .join('');
  const table = list.length
    ? `<table><thead><tr><th>Received</th><th>From</th><th>To</th><th>Subject</th><th>Files</th></tr></thead><tbody>${rows}</tbody></table>`
    : '<p>No mail yet. Messages sent to this fake appear here.</p>';
  return page('Local mailbox', `<h1>Local mailbox</h1><p>${list.length} message(s), newest first.</p>${table}`);
}

function messagePage(m: Message): string {
  const files = m.attachments
    .map((a, i) => `<li><a href="/api/messages/${m.id}/attachments/${i}" download="${escapeHtml(a.filename)}">${escapeHtml(a.filename)}</a> (${escapeHtml(a.contentType)}, ${a.size} bytes)</li>`)
    .join('');
  // The HTML part is shown in a sandboxed frame so its scripts and styles stay inside it.
  const htmlPart = m.html
    ? `<h2>HTML part</h2><iframe sandbox="" style="width:100%;height:24rem;border:1px solid #E4DBCF;background:#fff" srcdoc="${escapeHtml(m.html)}"></iframe>`
    : '';
  return page(m.subject, `<p><a href="/">← Back to the mailbox</a></p><h1>${escapeHtml(m.subject || '(no subject)')}</h1>
<p>From: ${escapeHtml(m.from)}<br>To: ${escapeHtml(m.to.join(', '))}<br>Received: ${escapeHtml(new Date(m.date).toLocaleString())}</p>
${files ? `<h2>Attachments</h2><ul>${files}</ul>` : ''}<h2>Text</h2><pre>${escapeHtml(m.text)}</pre>${htmlPart}`);
}

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown; once: (ev: 'error', cb: (e: Error) => void) => unknown }, port: number, host: string) {
  return new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
}

export async function startMailFake(opts: MailFakeOptions = {}): Promise<MailFake> {
  const host = opts.host ?? '127.0.0.1';
  let store: Message[] = [];
  let waiters: Waiter[] = [];

  const smtp = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    allowInsecureAuth: true,
    logger: false,
    banner: 'Tamp & Tally local mail fake',
    onAuth(auth, _session, cb) {
      cb(null, { user: auth.username ?? 'anyone' });
    },
    onData(stream, session, cb) {
      simpleParser(stream)
        .then((parsed) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const mailFrom = session.envelope.mailFrom;
          const message: Message = {
            id: randomUUID(),
            from: addresses(parsed.from)[0] ?? (mailFrom ? mailFrom.address : ''),
            to: envelopeTo.length ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? 'attachment',
              contentType: a.contentType,
              size: a.content.length,
              content: a.content,
            })),
            date: new Date().toISOString(),
          };
          store.push(message);
          const ready = waiters.filter((w) => w.pred(message));
          waiters = waiters.filter((w) => !ready.includes(w));
          ready.forEach((w) => w.resolve(message));
          cb();
        })
        .catch((err: Error) => cb(err));
    },
  });

  const newestFirst = () => [...store].reverse();

  const web = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://localhost');
    const send = (status: number, type: string, body: string | Buffer, extra: Record<string, string> = {}) => {
      res.writeHead(status, { 'Content-Type': type, ...extra });
      res.end(body);
    };
    const json = (status: number, body: unknown) => send(status, 'application/json; charset=utf-8', JSON.stringify(body));
    const find = (id: string) => store.find((m) => m.id === id);
    const parts = url.pathname.split('/').filter(Boolean);

    if (req.method === 'GET' && url.pathname === '/') return send(200, 'text/html; charset=utf-8', mailboxPage(newestFirst()));
    if (req.method === 'GET' && parts[0] === 'messages' && parts.length === 2) {
      const m = find(parts[1]);
      return m ? send(200, 'text/html; charset=utf-8', messagePage(m)) : send(404, 'text/plain', 'No such message');
    }
    if (parts[0] === 'api' && parts[1] === 'messages') {
      if (parts.length === 2 && req.method === 'GET') return json(200, { messages: newestFirst().map(summary) });
      if (parts.length === 2 && req.method === 'DELETE') {
        store = [];
        res.writeHead(204);
        return res.end();
      }
      const m = parts[2] ? find(parts[2]) : undefined;
      if (!m) return json(404, { error: { code: 'not_found', message: 'No such message' } });
      if (parts.length === 3 && req.method === 'GET') return json(200, { message: summary(m) });
      if (parts.length === 5 && parts[3] === 'attachments' && req.method === 'GET') {
        const a = m.attachments[Number(parts[4])];
        if (!a) return json(404, { error: { code: 'not_found', message: 'No such attachment' } });
        return send(200, a.contentType, a.content, {
          'Content-Disposition': `attachment; filename="${a.filename.replace(/["\\\r\n]/g, '_')}"`,
          'Content-Length': String(a.size),
        });
      }
    }
    json(404, { error: { code: 'not_found', message: 'Not found' } });
  });

  await listen(smtp.server, opts.smtpPort ?? 0, host);
  try {
    await listen(web, opts.httpPort ?? 0, host);
  } catch (err) {
    await new Promise<void>((r) => smtp.close(() => r()));
    throw err;
  }
  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const httpPort = (web.address() as AddressInfo).port;

  return {
    smtpPort,
    httpUrl: `http://${host}:${httpPort}`,
    messages: () => newestFirst(),
    waitForMessage(pred, timeoutMs = 5000) {
      const already = store.find(pred);
      if (already) return Promise.resolve(already);
      return new Promise<Message>((resolve, reject) => {
        const waiter: Waiter = {
          pred,
          resolve: (m) => {
            clearTimeout(timer);
            resolve(m);
          },
        };
        const timer = setTimeout(() => {
          waiters = waiters.filter((w) => w !== waiter);
          reject(new Error(`No matching mail arrived within ${timeoutMs} ms`));
        }, timeoutMs);
        waiters.push(waiter);
      });
    },
    clear() {
      store = [];
    },
    async close() {
      await Promise.all([
        new Promise<void>((r) => smtp.close(() => r())),
        new Promise<void>((r) => {
          web.closeAllConnections();
          web.close(() => r());
        }),
      ]);
    },
  };
}

import http from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

/**
 * A local SMTP fake for development and tests: accepts every message on loopback, keeps it in
 * memory, and lists it over a small HTTP API (GET /messages, GET /messages/:id, DELETE /messages).
 * It never relays anything anywhere.
 */
export interface CaughtMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

export interface MailCatcher {
  smtpPort: number;
  apiPort: number;
  messages: CaughtMail[];
  waitFor(predicate: (m: CaughtMail) => boolean, timeoutMs?: number): Promise<CaughtMail>;
  close(): Promise<void>;
}

export async function startMailCatcher(opts: { smtpPort: number; apiPort?: number; host?: string }): Promise<MailCatcher> {
  const host = opts.host ?? '127.0.0.1';
  const messages: CaughtMail[] = [];
  const waiters: Array<{ predicate: (m: CaughtMail) => boolean; resolve: (m: CaughtMail) => void }> = [];
  let nextId = 1;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const toField = parsed.to ? (Array.isArray(parsed.to) ? parsed.to : [parsed.to]) : [];
          const mail: CaughtMail = {
            id: nextId++,
            from: parsed.from?.text ?? '',
            to: toField.flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : '',
            receivedAt: new Date().toISOString(),
          };
          messages.push(mail);
          for (const w of [...waiters]) {
            if (w.predicate(mail)) {
              waiters.splice(waiters.indexOf(w), 1);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((err) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(opts.smtpPort, host, () => resolve());
  });
  let api: http.Server | null = null;
  if (opts.apiPort) {
    api = http.createServer((req, res) => {
      const send = (status: number, body: unknown) => {
        res.writeHead(status, { 'content-type': 'application/json' });
        res.end(JSON.stringify(body));
      };
      const match = req.url?.match(/^\/messages(?:\/(\d+))?(?:\?.*)?$/);
      if (!match) return send(404, { error: 'use /messages' });
      if (req.method === 'DELETE') {
        messages.length = 0;
        return send(200, { deleted: true });
      }
      if (match[1]) {
        const m = messages.find((x) => x.id === Number(match[1]));
        return m ? send(200, m) : send(404, { error: 'no such message' });
      }
      const to = new URL(req.url!, 'http://x').searchParams.get('to');
      return send(200, to ? messages.filter((m) => m.to.includes(to)) : messages);
    });
    await new Promise<void>((resolve, reject) => {
      api!.once('error', reject);
      api!.listen(opts.apiPort, host, () => resolve());
    });
  }
  return {
    smtpPort: opts.smtpPort,
    apiPort: opts.apiPort ?? 0,
    messages,
    waitFor(predicate, timeoutMs = 10000) {
      const found = messages.find(predicate);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const w = { predicate, resolve: (m: CaughtMail) => { clearTimeout(t); resolve(m); } };
        const t = setTimeout(() => {
          waiters.splice(waiters.indexOf(w), 1);
          reject(new Error(`no matching e-mail within ${timeoutMs} ms`));
        }, timeoutMs);
        waiters.push(w);
      });
    },
    async close() {
      await new Promise<void>((r) => smtp.close(() => r()));
      if (api) await new Promise<void>((r) => api!.close(() => r()));
    },
  };
}

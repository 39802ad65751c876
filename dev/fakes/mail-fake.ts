// A local mail catcher for development and tests: an SMTP server that keeps messages in memory and a small
// web page listing them (plus JSON at /api/messages). `tsx dev/fakes/mail-fake.ts` runs it on 2525/3025.
import http from "node:http";
import type { AddressInfo } from "node:net";
import { pathToFileURL } from "node:url";
import { SMTPServer } from "smtp-server";
import PostalMime from "postal-mime";

export interface CaughtMessage {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  /** SMTP URL to give nodemailer (`smtp://127.0.0.1:<port>`). */
  smtpUrl: string;
  /** The web page listing caught mail (`http://127.0.0.1:<port>/`); JSON at `<httpUrl>api/messages`. */
  httpUrl: string;
  messages(): CaughtMessage[];
  clear(): void;
  stop(): Promise<void>;
}

const HOST = "127.0.0.1";

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

async function readStream(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk));
  return Buffer.concat(chunks);
}

function listPage(messages: CaughtMessage[]): string {
  const rows = messages
    .slice()
    .reverse()
    .map(
      (m) =>
        `<tr><td>${escapeHtml(m.receivedAt)}</td><td>${escapeHtml(m.to.join(", "))}</td>` +
        `<td><a href="/messages/${m.id}">${escapeHtml(m.subject)}</a></td></tr>`,
    )
    .join("");
  return page(
    "Caught mail",
    `<p>${messages.length} message(s). JSON: <a href="/api/messages">/api/messages</a></p>` +
      `<table><thead><tr><th>Received</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>`,
  );
}

function messagePage(m: CaughtMessage): string {
  return page(
    m.subject,
    `<p><a href="/">All mail</a></p><p>From ${escapeHtml(m.from)} to ${escapeHtml(m.to.join(", "))}, ${escapeHtml(m.receivedAt)}</p>` +
      `<h2>HTML part</h2><iframe sandbox srcdoc="${escapeHtml(m.html)}" style="width:100%;height:420px;border:1px solid #ccc"></iframe>` +
      `<h2>Plain-text part</h2><pre style="white-space:pre-wrap">${escapeHtml(m.text)}</pre>`,
  );
}

function page(title: string, body: string): string {
  return `<!doctype html><html><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<style>body{font-family:system-ui,sans-serif;margin:24px}td,th{padding:4px 12px;text-align:left;border-bottom:1px solid #ddd}</style>
</head><body><h1>${escapeHtml(title)}</h1>${body}</body></html>`;
}

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown }, port: number): Promise<void> {
  return new Promise((resolve) => server.listen(port, HOST, resolve));
}

function createHttpServer(store: CaughtMessage[]): http.Server {
  return http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", `http://${HOST}`);
    const send = (status: number, type: string, body: string) => {
      res.writeHead(status, { "content-type": `${type}; charset=utf-8`, "cache-control": "no-store" });
      res.end(body);
    };
    if (url.pathname === "/api/messages" && req.method === "DELETE") {
      store.length = 0;
      return send(200, "application/json", JSON.stringify({ messages: [] }));
    }
    if (url.pathname === "/api/messages") {
      const to = url.searchParams.get("to")?.toLowerCase();
      const messages = to ? store.filter((m) => m.to.includes(to)) : store;
      return send(200, "application/json", JSON.stringify({ messages }));
    }
    const match = /^\/messages\/(\d+)$/.exec(url.pathname);
    const message = match ? store.find((m) => m.id === Number(match[1])) : undefined;
    if (message) return send(200, "text/html", messagePage(message));
    if (url.pathname === "/") return send(200, "text/html", listPage(store));
    return send(404, "text/plain", "Not found");
  });
}

/** Starts both servers; port 0 picks free ports (tests). */
export async function startMailFake(options: { smtpPort?: number; httpPort?: number } = {}): Promise<MailFake> {
  const store: CaughtMessage[] = [];
  let nextId = 1;
  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      readStream(stream)
        .then((raw) => PostalMime.parse(raw))
        .then((email) => {
          const envelopeFrom = session.envelope.mailFrom;
          store.push({
            id: nextId++,
            from: email.from?.address ?? (envelopeFrom ? envelopeFrom.address : ""),
            to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
            subject: email.subject ?? "",
            text: email.text ?? "",
            html: email.html ?? "",
            receivedAt: new Date().toISOString(),
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  const web = createHttpServer(store);
  await listen(smtp, options.smtpPort ?? 2525);
  await listen(web, options.httpPort ?? 3025);
  const smtpPort = (smtp.server.address() as AddressInfo).port;
  const httpPort = (web.address() as AddressInfo).port;
  return {
    smtpPort,
    httpPort,
    smtpUrl: `smtp://${HOST}:${smtpPort}`,
    httpUrl: `http://${HOST}:${httpPort}/`,
    messages: () => store.slice(),
    clear: () => {
      store.length = 0;
    },
    stop: async () => {
      web.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        new Promise<void>((resolve) => web.close(() => resolve())),
      ]);
    },
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const fake = await startMailFake({
    smtpPort: Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525),
    httpPort: Number(process.env.MAIL_FAKE_HTTP_PORT ?? 3025),
  });
  console.log(`[plumbline] mail fake: SMTP ${fake.smtpUrl}, mail at ${fake.httpUrl}`);
}

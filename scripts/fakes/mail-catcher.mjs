// A local stand-in for the school's mail relay: accepts SMTP on loopback, keeps the parsed messages
// in memory, and lists them as JSON over HTTP so the admin mail page and the tests can read them.
import { createServer } from 'node:http';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

const args = Object.fromEntries(process.argv.slice(2).map((a) => a.replace(/^--/, '').split('=')));
const smtpPort = Number(args['smtp-port']);
const httpPort = Number(args['http-port']);
if (!smtpPort || !httpPort) {
  console.error('usage: mail-catcher.mjs --smtp-port=N --http-port=N');
  process.exit(2);
}

// Enough for a class's worth of notices; the oldest go first.
const KEEP = 500;
const messages = [];
let nextId = 1;

const addresses = (field) => (field ? [field].flat().flatMap((a) => a.value.map((v) => v.address)) : []);

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  banner: 'Benchwright local mail catcher',
  size: 5 * 1024 * 1024,
  async onData(stream, _session, callback) {
    try {
      const mail = await simpleParser(stream);
      messages.unshift({
        id: String(nextId++),
        from: addresses(mail.from)[0] ?? '',
        to: addresses(mail.to),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : '',
        receivedAt: new Date().toISOString(),
      });
      messages.length = Math.min(messages.length, KEEP);
      callback();
    } catch (err) {
      callback(err);
    }
  },
});
smtp.on('error', (err) => console.error('smtp:', err.message));

const http = createServer((req, res) => {
  const url = new URL(req.url ?? '/', 'http://localhost');
  const send = (status, body) => {
    // No keep-alive: a client reusing a connection just as the server times it out gets "other side closed".
    res.writeHead(status, { 'content-type': 'application/json', connection: 'close' });
    res.end(JSON.stringify(body));
  };
  if (url.pathname === '/health') return send(200, { ok: true });
  if (url.pathname === '/messages' && req.method === 'GET') {
    const to = url.searchParams.get('to')?.toLowerCase();
    return send(200, to ? messages.filter((m) => m.to.some((a) => a.toLowerCase() === to)) : messages);
  }
  if (url.pathname === '/messages' && req.method === 'DELETE') {
    messages.length = 0;
    return send(200, { ok: true });
  }
  send(404, { error: 'not found' });
});

smtp.listen(smtpPort, '127.0.0.1', () => {
  http.listen(httpPort, '127.0.0.1', () => console.log(`mail catcher: smtp ${smtpPort}, http ${httpPort}`));
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => process.exit(0));

// A local stand-in for the e-mail service: an SMTP server on loopback that keeps every message,
// and a small viewer (HTML at /, JSON at /messages). Started by `npm start` and `npm test`.
// Imports its packages lazily: the bootstrap runs before `npm ci`.
import http from 'node:http';

export async function startMailCatcher({ smtpPort, viewerPort }) {
  const { SMTPServer } = await import('smtp-server');
  const { simpleParser } = await import('mailparser');
  const messages = [];
  const smtp = new SMTPServer({
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    // On stop, a session still open (a sender killed mid-message) is cut after a second, not 30.
    closeTimeout: 1_000,
    onData(stream, _session, done) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            messageId: mail.messageId ?? '',
            from: mail.from?.text ?? '',
            to: (Array.isArray(mail.to) ? mail.to : [mail.to]).flatMap((a) => a?.value ?? []).map((a) => a.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            date: (mail.date ?? new Date()).toISOString(),
          });
          done();
        })
        .catch(done);
    },
  });
  await new Promise((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort, '127.0.0.1', resolve);
  });
  smtp.removeAllListeners('error');
  // A sender that goes away mid-session (the app killed, a reset socket) is the sender's problem:
  // logged, never thrown, so it cannot take down the process that hosts the catcher.
  smtp.on('error', (error) => console.warn(`[mail] catcher: ${error.message}`));
  const escape = (s) => String(s).replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]);
  const viewer = http.createServer((req, res) => {
    if (req.url === '/messages') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify(messages));
      return;
    }
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8' });
    res.end(
      `<!doctype html><title>Hotwell — caught e-mail</title><h1>Caught e-mail (${messages.length})</h1>` +
        messages
          .slice()
          .reverse()
          .map((m) => `<article><h2>${escape(m.subject)}</h2><p>${escape(m.date)} · to ${escape(m.to.join(', '))}</p><pre>${escape(m.text)}</pre></article>`)
          .join('<hr>'),
    );
  });
  await new Promise((resolve, reject) => {
    viewer.once('error', reject);
    viewer.listen(viewerPort, '127.0.0.1', resolve);
  });
  viewer.removeAllListeners('error');
  viewer.on('error', (error) => console.warn(`[mail] viewer: ${error.message}`));
  viewer.on('clientError', (_error, socket) => socket.destroy());
  // Port 0 asks the system for a free port; report the one actually used.
  return {
    smtpUrl: `smtp://127.0.0.1:${smtp.server.address().port}`,
    viewerUrl: `http://127.0.0.1:${viewer.address().port}`,
    messages,
    stop: () =>
      Promise.all([
        new Promise((r) => smtp.close(r)),
        new Promise((r) => {
          viewer.close(r);
          viewer.closeAllConnections();
        }),
      ]),
  };
}

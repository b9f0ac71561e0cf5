// A local stand-in for the mail relay: accepts any message on 127.0.0.1:$SMTP_PORT and keeps each
// one as JSON in $MAIL_DIR (default .data/mail), where tests and developers can read it.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const port = Number(process.env.SMTP_PORT ?? 2525);
const dir = process.env.MAIL_DIR ?? join(process.cwd(), '.data', 'mail');
mkdirSync(dir, { recursive: true });
let seq = 0;

const server = new SMTPServer({
  authOptional: true,
  // No reverse DNS: on a closed network each lookup waits for a time-out.
  disableReverseLookup: true,
  disabledCommands: ['STARTTLS'],
  size: 5 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((mail) => {
        const to = session.envelope.rcptTo.map((r) => r.address);
        const file = join(dir, `${Date.now()}-${process.pid}-${++seq}.json`);
        writeFileSync(file, JSON.stringify({ from: session.envelope.mailFrom && session.envelope.mailFrom.address, to, subject: mail.subject ?? '', text: mail.text ?? '', receivedAt: new Date().toISOString() }, null, 2));
        callback();
      })
      .catch((err: Error) => callback(err));
  },
});

server.listen(port, '127.0.0.1', () => console.log(`Fake SMTP server on 127.0.0.1:${port}, keeping mail in ${dir}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

#!/usr/bin/env node
// A local SMTP server for development and tests: it accepts every message over a real SMTP
// conversation and stores it, parsed, as one JSON file per message in the given folder, where
// the API's mail outbox (admins only) reads it. Nothing is relayed anywhere.
//
//   node deploy/scripts/mail-catcher.mjs --port 2560 --dir .data/dev/mail
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

const { values } = parseArgs({ options: { port: { type: 'string' }, dir: { type: 'string' }, host: { type: 'string', default: '127.0.0.1' } } });
if (!values.port || !values.dir) {
  process.stderr.write('usage: mail-catcher.mjs --port <port> --dir <folder>\n');
  process.exit(2);
}
const dir = path.resolve(values.dir);
mkdirSync(dir, { recursive: true });

// Largest message accepted; the app sends short notices, so anything bigger is a mistake.
const MAX_BYTES = 10 * 1024 * 1024;
let sequence = 0;

const addresses = (field) => (field ? (Array.isArray(field) ? field : [field]).flatMap((a) => a.value.map((v) => v.address)) : []);

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  size: MAX_BYTES,
  banner: 'Sixtyfold development mail catcher; nothing is delivered',
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const receivedAt = new Date();
      // Sortable and unique: the time, then a counter for messages within the same millisecond.
      const id = `${receivedAt.getTime()}-${String(sequence++).padStart(6, '0')}`;
      const message = {
        id,
        receivedAt: receivedAt.toISOString(),
        envelope: { from: session.envelope.mailFrom?.address ?? null, to: session.envelope.rcptTo.map((r) => r.address) },
        from: addresses(mail.from)[0] ?? null,
        to: addresses(mail.to),
        subject: mail.subject ?? '',
        text: mail.text ?? '',
        html: typeof mail.html === 'string' ? mail.html : null,
        messageId: mail.messageId ?? null,
        headers: Object.fromEntries([...mail.headers].filter(([, v]) => typeof v === 'string')),
      };
      // Written under a temporary name first, so a reader never sees half a file.
      const file = path.join(dir, `${id}.json`);
      writeFileSync(`${file}.part`, JSON.stringify(message, null, 2));
      renameSync(`${file}.part`, file);
      callback();
    }, callback);
  },
});

server.on('error', (error) => process.stderr.write(`mail catcher: ${error.message}\n`));
server.listen(Number(values.port), values.host, () => {
  process.stdout.write(`mail catcher listening on ${values.host}:${values.port}, storing in ${dir}\n`);
});
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

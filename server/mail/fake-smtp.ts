import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';

import { linksIn, plainTextBody } from './mail-body';

/** One message the fake SMTP server accepted. */
export interface ReceivedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  /** The raw message, headers and body (RFC 5322). */
  raw: string;
  /** The decoded plain-text body. */
  text: string;
  /** Every http(s) link in the body, in order (invitation and reset links). */
  links: string[];
}

/**
 * A local SMTP server on loopback that keeps every message in memory, so development and tests
 * can read the mail Rampart sends without any real mail system. Never started in production.
 */
export class FakeSmtpServer {
  private readonly _messages: ReceivedMail[] = [];
  private _server?: SMTPServer;
  private _port = 0;
  private _nextId = 1;

  /** Messages received so far, newest last. */
  get messages(): readonly ReceivedMail[] {
    return this._messages;
  }

  get port(): number {
    return this._port;
  }

  /** Starts listening on 127.0.0.1:`port` (0 = a free port) and resolves with the port. */
  start(port: number): Promise<number> {
    this._server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      logger: false,
      size: 1_000_000,
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          const raw = Buffer.concat(chunks).toString('utf8');
          const text = plainTextBody(raw);
          this._messages.push({
            id: this._nextId++,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: headerValue(raw, 'subject'),
            raw,
            text,
            links: linksIn(text),
          });
          if (this._messages.length > 500) this._messages.shift();
          callback();
        });
      },
    });
    const server = this._server;
    return new Promise((resolve, reject) => {
      server.once('error', reject);
      server.listen(port, '127.0.0.1', () => {
        this._port = (server.server.address() as AddressInfo).port;
        resolve(this._port);
      });
    });
  }

  stop(): Promise<void> {
    const server = this._server;
    this._server = undefined;
    return new Promise((resolve) => (server ? server.close(() => resolve()) : resolve()));
  }
}

/** Unfolds and returns one header of a raw message ('' when absent). */
export function headerValue(raw: string, name: string): string {
  const head = raw.split(/\r?\n\r?\n/, 1)[0] ?? '';
  const unfolded = head.replace(/\r?\n[ \t]+/g, ' ');
  const line = unfolded
    .split(/\r?\n/)
    .find((l) => l.toLowerCase().startsWith(`${name.toLowerCase()}:`));
  return line ? line.slice(name.length + 1).trim() : '';
}

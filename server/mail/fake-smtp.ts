// An in-process SMTP server for development and tests: captures every message so admins can
// read invitations and reset links on the console's outbox page instead of a real mailbox.
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface CapturedMail {
  id: number;
  received_at: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

export interface Outbox {
  messages(): CapturedMail[];
  clear(): void;
}

export interface FakeSmtp {
  url: string;
  outbox: Outbox;
  close(): Promise<void>;
}

const MAX_KEPT = 200;

export async function startFakeSmtp(port = 0): Promise<FakeSmtp> {
  const captured: CapturedMail[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          captured.unshift({
            id: nextId++,
            received_at: new Date().toISOString(),
            from: mail.from?.text ?? '',
            to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
          });
          captured.length = Math.min(captured.length, MAX_KEPT);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const { port: boundPort } = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${boundPort}`,
    outbox: {
      messages: () => [...captured],
      clear: () => {
        captured.length = 0;
      },
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

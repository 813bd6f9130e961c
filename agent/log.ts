// Structured logs: one JSON object per line, to a file rotated by size (rotating-file-stream) or,
// without a log file, to stdout (a service manager such as systemd keeps it).
import { createStream } from 'rotating-file-stream';
import { basename, dirname } from 'node:path';
import { AGENT_VERSION } from './version.ts';

export type LogLevel = 'debug' | 'info' | 'warn' | 'error';
export type LogFields = Record<string, unknown>;

export interface AgentLog {
  debug(msg: string, fields?: LogFields): void;
  info(msg: string, fields?: LogFields): void;
  warn(msg: string, fields?: LogFields): void;
  error(msg: string, fields?: LogFields): void;
  close(): Promise<void>;
}

interface Sink {
  write(line: string): void;
  close(): Promise<void>;
}

function fileSink(file: string): Sink {
  const stream = createStream(basename(file), { path: dirname(file), size: '10M', maxFiles: 10 });
  return {
    write: (line) => void stream.write(line),
    close: () => new Promise((done) => stream.end(() => done())),
  };
}

const streamSink = (stream: NodeJS.WriteStream): Sink => ({ write: (line) => void stream.write(line), close: async () => undefined });

/** To the file when given; otherwise stdout, or stderr where stdout is for people (--dry-run). */
export function createAgentLog(file: string | undefined, options: { stderr?: boolean } = {}): AgentLog {
  const sink = file ? fileSink(file) : streamSink(options.stderr ? process.stderr : process.stdout);
  const write =
    (level: LogLevel) =>
    (msg: string, fields: LogFields = {}) =>
      sink.write(`${JSON.stringify({ time: new Date().toISOString(), level, msg, agent: AGENT_VERSION, ...fields })}\n`);
  return { debug: write('debug'), info: write('info'), warn: write('warn'), error: write('error'), close: () => sink.close() };
}

export function errorMessage(error: unknown): string {
  if (error instanceof Error) {
    const cause = (error as { cause?: unknown }).cause;
    return cause instanceof Error ? `${error.message}: ${cause.message}` : error.message;
  }
  return String(error);
}

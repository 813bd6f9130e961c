// The agent's configuration: one JSON file, checked with zod so a typo stops the agent at start
// with a message naming the field. The API key may live outside it (a file only the service
// account can read, or the MELTWIRE_AGENT_KEY environment variable).
import { readFileSync } from 'node:fs';
import { dirname, isAbsolute, resolve } from 'node:path';
import { z } from 'zod';

export const KEY_ENV = 'MELTWIRE_AGENT_KEY';

const seconds = (fallback: number) => z.number().positive().max(86_400).default(fallback);

export const AgentConfigFileSchema = z
  .object({
    server_url: z.url({ protocol: /^https?$/ }).describe('Meltwire base address, e.g. https://meltwire.lab.example'),
    api_key: z.string().min(1).optional(),
    api_key_file: z.string().min(1).optional(),
    instrument_id: z.string().min(1).max(40),
    method_id: z.string().min(1).max(40),
    profile_id: z.string().min(1).max(40).optional(),
    folders: z.array(z.string().min(1)).min(1),
    patterns: z.array(z.string().min(1)).min(1).default(['*.csv', '*.txt']),
    stable_seconds: seconds(10),
    poll_seconds: seconds(5),
    heartbeat_seconds: seconds(60),
    retry_base_seconds: seconds(2),
    retry_max_seconds: seconds(300),
    upload_timeout_seconds: seconds(120),
    ledger_file: z.string().min(1).default('meltwire-agent-ledger.jsonl'),
    log_file: z.string().min(1).optional(),
    delete_after_success: z.boolean().default(false),
  })
  .strict();

export type AgentConfig = Omit<z.output<typeof AgentConfigFileSchema>, 'api_key' | 'api_key_file'> & {
  apiKey: string;
  /** Where the key came from, for the start-up log line (never the key itself). */
  keySource: 'environment' | 'api_key_file' | 'config';
};

export class ConfigError extends Error {}

function describeIssues(error: z.ZodError): string {
  return error.issues.map((issue) => `  ${issue.path.join('.') || '(file)'}: ${issue.message}`).join('\n');
}

function readKey(
  file: z.output<typeof AgentConfigFileSchema>,
  baseDir: string,
  env: NodeJS.ProcessEnv,
): Pick<AgentConfig, 'apiKey' | 'keySource'> {
  const fromEnv = env[KEY_ENV]?.trim();
  if (fromEnv) return { apiKey: fromEnv, keySource: 'environment' };
  if (file.api_key_file) {
    const path = resolve(baseDir, file.api_key_file);
    let text: string;
    try {
      text = readFileSync(path, 'utf8');
    } catch (error) {
      throw new ConfigError(`api_key_file ${path} cannot be read: ${(error as Error).message}`);
    }
    if (!text.trim()) throw new ConfigError(`api_key_file ${path} is empty`);
    return { apiKey: text.trim(), keySource: 'api_key_file' };
  }
  if (file.api_key) return { apiKey: file.api_key, keySource: 'config' };
  throw new ConfigError(`no API key: set ${KEY_ENV}, or api_key_file (preferred) or api_key in the configuration`);
}

/** Parses a configuration; relative paths are taken from the configuration file's folder. */
export function parseAgentConfig(json: unknown, baseDir: string, env: NodeJS.ProcessEnv = process.env): AgentConfig {
  const parsed = AgentConfigFileSchema.safeParse(json);
  if (!parsed.success) throw new ConfigError(`the configuration is not valid:\n${describeIssues(parsed.error)}`);
  const file = parsed.data;
  const at = (path: string) => (isAbsolute(path) ? path : resolve(baseDir, path));
  const { api_key: _key, api_key_file: _keyFile, ...rest } = file;
  return {
    ...rest,
    ...readKey(file, baseDir, env),
    server_url: file.server_url.replace(/\/+$/, ''),
    folders: file.folders.map(at),
    ledger_file: at(file.ledger_file),
    log_file: file.log_file ? at(file.log_file) : undefined,
  };
}

export function loadAgentConfig(path: string, env: NodeJS.ProcessEnv = process.env): AgentConfig {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    throw new ConfigError(`the configuration ${path} cannot be read: ${(error as Error).message}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new ConfigError(`the configuration ${path} is not JSON: ${(error as Error).message}`);
  }
  return parseAgentConfig(json, dirname(resolve(path)), env);
}

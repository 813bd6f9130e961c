// What a process log line shows of a request and its response: the same redaction as the request
// log (server/domain/request-log/redact.ts), applied to the URL, and only allow-listed headers.
import { headersForLog, redactUrl } from '../domain/request-log/redact.ts';

type Headers = Record<string, string | string[] | number | undefined>;

interface SerializedRequest {
  id?: unknown;
  method?: string;
  url?: string;
  headers?: Headers;
  remoteAddress?: string;
}

interface SerializedResponse {
  statusCode?: number;
  headers?: Headers;
}

export const logSerializers = {
  req: (req: SerializedRequest) => ({
    id: req.id,
    method: req.method,
    url: redactUrl(req.url ?? '').value,
    headers: headersForLog(req.headers ?? {}),
    remoteAddress: req.remoteAddress,
  }),
  res: (res: SerializedResponse) => ({ statusCode: res.statusCode, headers: headersForLog(res.headers ?? {}) }),
};

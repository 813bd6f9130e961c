// "Try it out" shows the call as a curl command that works when pasted: the console's own call
// carries the session cookie, the copied one sends the reader's key from $MELTWIRE_KEY.
import { CodeBlock } from '../../components/ui/code-block.tsx';
import { curlCommand, type CurlInput } from '../../lib/curl.ts';

/** The request as swagger-ui keeps it (an Immutable.js map). */
interface SwaggerRequest {
  get(key: 'url' | 'method'): string | undefined;
  get(key: 'headers'): { toJS(): Record<string, string> } | undefined;
  get(key: 'body'): unknown;
}

function multipartBody(form: FormData): string {
  const fields: Record<string, string> = {};
  const files: { field: string; name: string; content_type: string }[] = [];
  form.forEach((value, field) => {
    if (typeof value === 'string') fields[field] = value;
    else files.push({ field, name: value.name, content_type: value.type || 'application/octet-stream' });
  });
  return JSON.stringify({ fields, files });
}

export function curlInputOf(request: SwaggerRequest): { input: CurlInput; origin: string } {
  const url = new URL(request.get('url') ?? '/', window.location.origin);
  const headers = Object.fromEntries(
    Object.entries(request.get('headers')?.toJS() ?? {}).map(([name, value]) => [name.toLowerCase(), value]),
  );
  const body = request.get('body');
  const multipart = body instanceof FormData;
  return {
    origin: url.origin,
    input: {
      method: (request.get('method') ?? 'GET').toUpperCase(),
      path: url.pathname,
      query: url.search.replace(/^\?/, ''),
      request: {
        // The call runs with the console session: the copied command authenticates with a key.
        headers: { ...headers, authorization: 'session' },
        body: multipart ? multipartBody(body) : typeof body === 'string' && body !== '' ? body : null,
        body_kind: multipart ? 'multipart' : typeof body === 'string' && body !== '' ? 'json' : 'none',
        content_type: headers['content-type'] ?? null,
      },
    },
  };
}

/** Replaces swagger-ui's "Curl" box (registered as the `curl` component). */
export function TryItCurl({ request }: { request: SwaggerRequest }) {
  const { input, origin } = curlInputOf(request);
  return (
    <div className="my-3">
      <CodeBlock label="curl (set MELTWIRE_KEY to your API key first)" code={curlCommand(input, origin)} testId="try-it-curl" />
    </div>
  );
}

/** The swagger-ui plugin that puts TryItCurl in place of the built-in box. */
export const tryItCurlPlugin = () => ({ components: { curl: TryItCurl } });

import { Link } from 'react-router';
import { CodeBlock } from '../../components/ui/code-block.tsx';
import { Alert } from '../../components/ui/feedback.tsx';
import { Card, PageHeader } from '../../components/ui/layout.tsx';
import { quickStartExamples } from '../../features/quick-start/examples.ts';
import { paths } from '../../config/paths.ts';

export function QuickStartPage() {
  const examples = quickStartExamples(window.location.origin);
  return (
    <>
      <PageHeader
        title="Quick start"
        description={
          <>
            Copy-paste examples for this server. Issue a key on{' '}
            <Link className="text-copper-700 underline" to={paths.apiKeys}>
              API keys
            </Link>
            , run them, then find each call in the{' '}
            <Link className="text-copper-700 underline" to={paths.requestLog}>
              Request log
            </Link>
            . Every operation is in the{' '}
            <Link className="text-copper-700 underline" to={paths.reference}>
              API reference
            </Link>
            .
          </>
        }
      />
      <div className="max-w-4xl space-y-6">
        {examples.map((example) => (
          <Card key={example.id} title={example.title}>
            <p className="mb-3 text-sm text-slag-700">{example.intro}</p>
            {example.files?.map((file) => (
              <div key={file.name} className="mb-3">
                <CodeBlock label={file.name} code={file.code} testId={`quick-start-${example.id}-${file.name}`} />
              </div>
            ))}
            <CodeBlock label="shell" code={example.code} testId={`quick-start-${example.id}`} />
            {example.output && (
              <div className="mt-3">
                <p className="mb-1 text-xs font-medium uppercase tracking-wide text-slag-500">You get</p>
                <pre
                  data-testid={`quick-start-${example.id}-output`}
                  className="whitespace-pre-wrap break-all rounded-md bg-ash-100 p-3 text-xs"
                >
                  {example.output}
                </pre>
                <p className="mt-1 text-xs text-slag-500">
                  {example.outputNote ?? 'On the demo data; “…” marks what is left out or differs from run to run (ids, times).'}
                </p>
              </div>
            )}
          </Card>
        ))}
        <Alert tone="info" title="Retry writes safely">
          Send an <code>Idempotency-Key</code> header (a new UUID per logical write) with every POST, PATCH and DELETE. Retrying with the
          same key and body within 24 hours returns the first answer again, marked <code>Idempotent-Replayed: true</code>, instead of
          writing twice.
        </Alert>
        <Alert tone="info" title="Stay within the rate limit">
          Each key has its own budget per minute. Every response carries <code>RateLimit</code> and <code>RateLimit-Policy</code> headers;
          over the budget you get <code>429</code> with <code>Retry-After</code> in seconds.
        </Alert>
      </div>
    </>
  );
}

import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { Alert } from '../../components/ui/feedback.tsx';
import { paths } from '../../config/paths.ts';

export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className="mx-auto max-w-xl p-10">
      <Alert title="This page failed to load">
        <p>{message}</p>
        <p className="mt-2">
          <Link to={paths.home} className="text-copper-700 underline">
            Back to the overview
          </Link>
        </p>
      </Alert>
    </div>
  );
}

import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ProblemMessage } from '../components/problem-message';
import { ApiProblem } from '../lib/api-client';

/** What a person sees when a screen cannot load: the reason, and a way back. */
export function RouteError() {
  const error = useRouteError();
  const notFound =
    (error instanceof ApiProblem && error.status === 404) ||
    (isRouteErrorResponse(error) && error.status === 404);
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-2xl font-semibold">
        {notFound ? 'Not in the table' : 'This screen could not load'}
      </h1>
      <ProblemMessage
        error={
          isRouteErrorResponse(error) ? new Error(error.statusText || 'Page not found') : error
        }
      />
      <Link to="/" className="text-patina-700 underline">
        Back to the Catalogue
      </Link>
    </div>
  );
}

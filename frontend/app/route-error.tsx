import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { ProblemMessage } from '../components/problem-message';
import { ApiProblem } from '../lib/api-client';
import { NotFoundPage } from './not-found';

/** What a person sees when a screen cannot load: the reason, and a way back. */
export function RouteError() {
  const error = useRouteError();
  if (
    (error instanceof ApiProblem && error.status === 404) ||
    (isRouteErrorResponse(error) && error.status === 404)
  )
    // Only the Alloy sheet's loader asks the API for one record; a 404 from it is a missing alloy.
    return <NotFoundPage kind={error instanceof ApiProblem ? 'alloy' : 'page'} />;
  const shown =
    error instanceof Error || error instanceof ApiProblem
      ? error
      : new Error(
          isRouteErrorResponse(error)
            ? `The page answered ${error.status} ${error.statusText}`.trim()
            : 'The page stopped on an error of its own. Reloading it often helps.',
        );
  return (
    <div className="flex flex-col gap-3">
      <h1 className="text-2xl font-semibold">This screen could not load</h1>
      <ProblemMessage error={shown} title="Not loaded" />
      <p className="flex flex-wrap gap-4">
        <button
          type="button"
          className="text-patina-700 underline"
          onClick={() => window.location.reload()}
        >
          Reload the page
        </button>
        <Link to="/" className="text-patina-700 underline">
          Back to the Catalogue
        </Link>
      </p>
    </div>
  );
}

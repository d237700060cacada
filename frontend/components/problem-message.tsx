import { ApiProblem } from '../lib/api-client';

/** A failed request in plain words, with the field-level reasons when the service gave them. */
export function ProblemMessage({
  error,
  title = 'Something went wrong',
}: {
  error: unknown;
  title?: string;
}) {
  const problem = error instanceof ApiProblem ? error.problem : null;
  return (
    <div role="alert" className="rounded-md border border-copper-500 bg-copper-100 p-4 text-sm">
      <p className="font-semibold">{problem?.title ?? title}</p>
      <p>{problem?.detail ?? (error instanceof Error ? error.message : String(error))}</p>
      {problem?.errors?.length ? (
        <ul className="mt-2 list-disc pl-5">
          {problem.errors.map((e) => (
            <li key={e.path + e.message}>
              <code>{e.path}</code>: {e.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

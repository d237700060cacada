import { ApiProblem, type FieldProblem } from '../lib/api-client';
import { fieldProblems, labelOfField, plainMessage } from '../lib/field-errors';

/** What each kind of refusal means to the person, when the caller gives no title. */
function plainTitle(status: number | undefined): string {
  if (status === undefined) return 'Something went wrong';
  if (status === 0) return 'The service did not answer';
  if (status === 400 || status === 422) return 'Some entries need another look';
  if (status === 401) return 'You are not signed in';
  if (status === 403) return 'Your role may not do this';
  if (status === 404) return 'Not found';
  if (status === 409) return 'This clashes with the current state';
  if (status === 413) return 'That is more than the service accepts at once';
  if (status === 429) return 'Too many requests for now';
  if (status >= 500) return 'The service could not finish this';
  return 'Not done';
}

/**
 * The service's own sentence ('1 problem(s) in 1 row(s): nothing was imported.'), unless it only
 * repeats the field problems with their paths, as the validator's answers do.
 */
function plainDetail(error: unknown): string | null {
  if (error instanceof ApiProblem) {
    const detail = error.problem.detail;
    if (!detail || /(^|\s)\/(body|query|path)\b/.test(detail)) return null;
    if (
      error.problem.errors?.some(
        (e) => (e.path && detail.includes(e.path)) || detail.trim() === e.message.trim(),
      )
    )
      return null;
    return detail;
  }
  if (error instanceof Error) return error.message || null;
  return null;
}

/**
 * A message about the whole request, or one that already says where ('row 3, conductivity_ms_m:
 * …'), is shown as it is.
 */
const namesItsField = (p: FieldProblem) => {
  const last = p.field.split('.').pop();
  return !last || (!/^\d+$/.test(last) && p.message.includes(last));
};

/**
 * A failed request in plain words: a title, the service's explanation, and one line per field
 * problem with the field's label. A form that shows some problems beside its own fields passes
 * their map (`fields`, as given to setFieldErrors); those are not repeated here.
 */
export function ProblemMessage({
  error,
  title,
  fields,
}: {
  error: unknown;
  title?: string;
  fields?: Record<string, { label: string }>;
}) {
  const status = error instanceof ApiProblem ? error.status : undefined;
  const problems = fieldProblems(error);
  const marked = new Set(problems.filter((p) => fields?.[p.field]).map((p) => p.field)).size;
  const rest = problems.filter((p) => !fields?.[p.field]);
  const detail = plainDetail(error);
  return (
    <div role="alert" className="rounded-md border border-copper-500 bg-copper-100 p-4 text-sm">
      <p className="font-semibold">{title ?? plainTitle(status)}</p>
      {detail ? <p>{detail}</p> : null}
      {marked ? (
        <p>
          See the marked {marked === 1 ? 'field' : 'fields'}
          {rest.length ? ', and:' : '.'}
        </p>
      ) : null}
      {rest.length ? (
        <ul className="mt-1 list-disc pl-5">
          {rest.map((p) => (
            <li key={`${p.field}-${p.message}`}>
              {namesItsField(p)
                ? p.message
                : plainMessage(p.message, fields?.[p.field]?.label ?? labelOfField(p.field))}
            </li>
          ))}
        </ul>
      ) : null}
      {!detail && !problems.length && status === undefined && !(error instanceof Error) ? (
        <p>Try again in a moment.</p>
      ) : null}
    </div>
  );
}

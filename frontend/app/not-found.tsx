import { useEffect } from 'react';
import { Link, useLocation } from 'react-router-dom';

/** A word from the address worth searching the table for ('/alloys/cartridge-bras' → 'cartridge bras'). */
function searchableWords(pathname: string): string | null {
  const last = decodeURIComponentSafe(pathname.split('/').filter(Boolean).pop() ?? '');
  const words = last.replace(/[-_+]+/g, ' ').trim();
  return /[a-z]/i.test(words) && words.length <= 60 ? words : null;
}

function decodeURIComponentSafe(s: string): string {
  try {
    return decodeURIComponent(s);
  } catch {
    return s;
  }
}

/** What an address that leads nowhere shows: that it is nobody's fault, and where to go instead. */
export function NotFoundPage({ kind = 'page' }: { kind?: 'page' | 'alloy' }) {
  const { pathname } = useLocation();
  const words = searchableWords(pathname);
  useEffect(() => {
    const before = document.title;
    document.title = 'Not found · Conductory';
    return () => {
      document.title = before;
    };
  }, []);
  return (
    <section aria-labelledby="not-found-title" className="flex max-w-2xl flex-col gap-3">
      <h1 id="not-found-title" className="text-2xl font-semibold tracking-tight">
        {kind === 'alloy' ? 'No such alloy in the table' : 'Nothing at this address'}
      </h1>
      <p>
        {kind === 'alloy' ? 'No alloy in the table is filed at ' : 'Conductory has no page at '}
        <code className="break-all">{pathname}</code>. The link may be mistyped, or the page may
        have moved.
      </p>
      <ul className="flex flex-col gap-1">
        {words ? (
          <li>
            <Link className="text-patina-700 underline" to={`/?q=${encodeURIComponent(words)}`}>
              Search the Catalogue for “{words}”
            </Link>
          </li>
        ) : null}
        <li>
          <Link className="text-patina-700 underline" to="/">
            Open the Catalogue
          </Link>
        </li>
        <li>
          <Link className="text-patina-700 underline" to="/match">
            Match a reading
          </Link>
        </li>
      </ul>
    </section>
  );
}

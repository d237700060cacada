import { Link } from 'react-router-dom';

/** The small link from a calculator to the Checks screen, under the screen's introduction. */
export function HowDoWeKnow() {
  return (
    <Link to="/checks" className="text-sm text-patina-700 underline underline-offset-2">
      How do we know?
    </Link>
  );
}

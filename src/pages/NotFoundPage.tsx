import { Link, useLocation } from 'react-router-dom';

export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <div className="mx-auto max-w-xl px-6 py-16">
      <h1 className="text-2xl font-semibold">Nothing at <span className="num">{pathname}</span></h1>
      <p className="mt-2 text-ink-muted">The address may be mistyped, or the sheet was moved or deleted.</p>
      <Link to="/" className="mt-4 inline-block text-accent underline">Back to the start page</Link>
    </div>
  );
}

import { Link } from 'react-router-dom';

export function NotFoundPage() {
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>Nothing here</h1>
      <p className="mt-2 text-sm text-ink-soft">The address does not match a page of Cleancase.</p>
      <Link className="mt-4 inline-block text-sm text-tube-700 underline" to="/">
        Go to the overview
      </Link>
    </main>
  );
}

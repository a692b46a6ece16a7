import { Link } from 'react-router';

export function NotFoundPage() {
  return (
    <section className="mx-auto max-w-xl py-12 text-center">
      <h1 className="text-3xl font-bold">Nothing here</h1>
      <p className="mt-3 text-muted">This address does not lead to a Hotwell page.</p>
      <Link to="/" className="mt-6 inline-block font-bold text-accent underline">
        Back to the overview
      </Link>
    </section>
  );
}

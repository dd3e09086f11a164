import { Link } from 'react-router-dom';

/** No route matches the address. */
export function NotFound() {
  return (
    <section className="space-y-3 py-8">
      <h1 className="text-xl font-semibold">Nothing here</h1>
      <p className="text-ink-700">This address does not match a page in Threadline.</p>
      <Link to="/projects" className="font-medium text-brand-700 underline">
        Back to projects
      </Link>
    </section>
  );
}

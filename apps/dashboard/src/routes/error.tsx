import { isRouteErrorResponse, Link, useRouteError } from 'react-router';

export function RouteError() {
  const error = useRouteError();
  const title = isRouteErrorResponse(error) && error.status === 404 ? 'Page not found' : 'Something went wrong';
  return (
    <section className="mx-auto max-w-xl space-y-3 px-6 py-16">
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="text-ink-soft">
        <Link className="text-brand underline" to="/">
          Back to the start
        </Link>
      </p>
    </section>
  );
}

import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { describeError } from '../components/states';
import { buttonClass } from '../components/ui';

/** What a route shows when its loader or rendering failed: usually the API being unreachable. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  return (
    <main id="main" className="mx-auto max-w-xl space-y-4 px-6 py-16">
      <h1 className="text-2xl font-bold tracking-tight">
        {notFound ? 'Page not found' : 'This page could not be shown'}
      </h1>
      <p role="alert" className="text-ink-soft">
        {notFound ? 'There is no page at this address.' : describeError(error)}
      </p>
      <div className="flex flex-wrap gap-3">
        {!notFound ? (
          <button type="button" className={buttonClass('primary')} onClick={() => window.location.reload()}>
            Try again
          </button>
        ) : null}
        <Link className={buttonClass()} to="/">
          Back to the start
        </Link>
      </div>
    </main>
  );
}

export function NotFoundPage() {
  return (
    <section className="space-y-3">
      <h1 className="text-2xl font-bold tracking-tight">Page not found</h1>
      <p className="text-ink-soft">
        There is no page at this address. It may have moved, or the link was mistyped.
      </p>
      <Link className={buttonClass()} to="/">
        Back to the start
      </Link>
    </section>
  );
}

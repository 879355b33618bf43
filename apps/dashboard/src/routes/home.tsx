import { redirect } from 'react-router';
import { queryClient } from '../lib/query-client';
import { meQuery } from '../queries/session';
import { homeFor } from '../lib/session';
import { usePageTitle } from '../lib/use-page-title';
import { ButtonLink } from '../components/ui';

/** Signed-in people go straight to their organisation; everyone else gets the front door. */
export async function homeLoader() {
  try {
    const me = await queryClient.ensureQueryData(meQuery());
    if (me) return redirect(homeFor(me));
  } catch {
    // The API is down: the front door still shows, with the service status in its footer.
  }
  return null;
}

export function HomePage() {
  usePageTitle('Welcome');
  return (
    <section className="space-y-6">
      <div className="space-y-3">
        <h1 className="text-3xl font-bold tracking-tight">Wickstone</h1>
        <p className="text-ink-soft">
          Publish your firm's capillary-rise, interface-pressure, wetting-force and wicking calculators as
          branded widgets on your own website, and see who uses them.
        </p>
      </div>
      <div className="flex flex-wrap gap-3">
        <ButtonLink to="/login" tone="primary">
          Sign in
        </ButtonLink>
        <ButtonLink to="/signup">Set up your firm</ButtonLink>
      </div>
    </section>
  );
}

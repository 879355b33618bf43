import { Link, Outlet } from 'react-router';
import { useQuery } from '@tanstack/react-query';
import { HealthStatus } from '../components/health-status';
import { RiseFigure } from '../components/rise-figure';
import { devMailQuery } from '../queries/dev-mail';
import { BrandLink } from '../components/ui';

/** Pages for people who are not signed in: a quiet brand panel beside the form. */
export function PublicLayout() {
  const devMail = useQuery(devMailQuery());
  return (
    <div className="flex min-h-screen flex-col md:grid md:grid-cols-[minmax(18rem,2fr)_3fr]">
      <aside className="on-dark bg-brand-strong text-brand-tint md:sticky md:top-0 md:h-screen">
        <div className="flex h-full flex-col gap-6 px-6 py-5 md:px-10 md:py-10">
          <BrandLink large />
          <div className="hidden flex-1 flex-col justify-center gap-8 md:flex">
            <RiseFigure className="w-full max-w-sm" />
            <p className="max-w-sm text-lg leading-relaxed">
              Capillarity calculators under your own name: on your site, in your clients' portals, with the
              working shown.
            </p>
          </div>
          <p className="hidden text-sm text-brand-tint/70 md:block">
            Results are estimates; site investigation still decides.
          </p>
        </div>
      </aside>
      <div className="flex flex-1 flex-col">
        <main
          id="main"
          className="flex flex-1 items-start justify-center px-5 py-10 md:items-center md:px-10"
        >
          <div className="w-full max-w-md">
            <Outlet />
          </div>
        </main>
        <footer className="flex flex-wrap items-center justify-between gap-x-6 gap-y-2 border-t border-line px-5 py-4 md:px-10">
          <HealthStatus />
          {devMail.isSuccess ? (
            <Link to="/dev/mail" className="text-sm font-semibold text-brand underline underline-offset-4">
              Dev mailbox
            </Link>
          ) : null}
        </footer>
      </div>
    </div>
  );
}

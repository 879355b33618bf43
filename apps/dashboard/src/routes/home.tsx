import { useQuery } from '@tanstack/react-query';
import { healthQuery } from '../queries/health';
import { ApiError } from '../lib/api';

function HealthStatus() {
  const { data, error, isPending } = useQuery(healthQuery());
  if (isPending) {
    return <p role="status" className="text-ink-soft">Checking the service…</p>;
  }
  if (error) {
    const message = error instanceof ApiError ? error.body.message : 'The server cannot be reached';
    return (
      <p role="status" data-health="down" className="rounded-lg border border-bad bg-bad-tint px-4 py-3 text-bad">
        Service degraded: {message}
      </p>
    );
  }
  return (
    <p role="status" data-health="ok" className="rounded-lg border border-ok bg-ok-tint px-4 py-3 text-ok">
      Service healthy · database round trip {data.database.roundTripMs} ms · server {data.version}
    </p>
  );
}

export function HomePage() {
  return (
    <section className="space-y-6">
      <div className="space-y-2">
        <h1 className="text-3xl font-bold tracking-tight">Wickstone</h1>
        <p className="max-w-2xl text-ink-soft">
          Publish your firm's capillary-rise, interface-pressure, wetting-force and wicking calculators as
          branded widgets on your own website, and see who uses them.
        </p>
      </div>
      <HealthStatus />
    </section>
  );
}

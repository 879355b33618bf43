import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { isApiError } from '../lib/api';
import { formatDateTime } from '../lib/labels';
import { usePageTitle } from '../lib/use-page-title';
import { verifyQuery } from '../queries/verify';
import { AuthPage } from '../components/auth-page';
import { ErrorState, LoadingState } from '../components/states';
import { Notice } from '../components/ui';

const RUN_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Public: anyone holding a calculation sheet checks that the engine gives what the sheet prints. */
export function VerifyPage() {
  usePageTitle('Verify a result');
  const runId = useParams().runId ?? '';
  const valid = RUN_ID.test(runId);
  const check = useQuery({ ...verifyQuery(runId), enabled: valid });

  if (!valid || isApiError(check.error, 404) || isApiError(check.error, 400)) {
    return (
      <AuthPage
        eyebrow="Verification"
        title="No result has this id"
        lead="Check the address on the sheet. A result the firm erased under its retention policy can no longer be verified."
      />
    );
  }
  if (check.isPending) return <LoadingState label="Re-running the calculation…" />;
  if (check.isError)
    return (
      <ErrorState
        title="The result could not be checked"
        error={check.error}
        onRetry={() => void check.refetch()}
      />
    );

  const v = check.data;
  return (
    <AuthPage eyebrow="Verification" title={v.calculator.title} lead={`Run ${v.runId}`}>
      <Notice tone={v.agrees ? 'ok' : 'bad'} role="status">
        <p className="font-semibold" data-verdict={v.agrees ? 'agrees' : 'disagrees'}>
          {v.agrees
            ? 'The engine agrees: re-running the stored inputs gives the stored result.'
            : 'The engine disagrees: re-running the stored inputs does not give the stored result.'}
        </p>
      </Notice>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-soft">Made</dt>
        <dd>{formatDateTime(v.createdAt)}</dd>
        <dt className="text-ink-soft">Engine</dt>
        <dd>
          calc-core {v.engineVersion.stored}
          {v.engineVersion.current !== v.engineVersion.stored
            ? ` (checked with ${v.engineVersion.current})`
            : ''}
        </dd>
        <dt className="text-ink-soft">Input hash</dt>
        <dd className="font-mono text-xs break-all">{v.inputHash.stored}</dd>
      </dl>
      <section className="space-y-2">
        <h2 className="font-semibold">Inputs</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          {v.inputs.map((i) => (
            <div key={i.id} className="contents">
              <dt className="text-ink-soft">{i.label}</dt>
              <dd>{i.text}</dd>
            </div>
          ))}
        </dl>
      </section>
      <section className="space-y-2">
        <h2 className="font-semibold">Outputs</h2>
        <table className="w-full text-left text-sm">
          <thead className="text-ink-soft">
            <tr>
              <th className="py-1 pr-3 font-normal">Output</th>
              <th className="py-1 pr-3 font-normal">Stored</th>
              <th className="py-1 font-normal">Re-computed</th>
            </tr>
          </thead>
          <tbody>
            {v.outputs.map((o) => (
              <tr key={o.id} className="border-t border-line">
                <th scope="row" className="py-1 pr-3 font-normal">
                  {o.label}
                </th>
                <td className="py-1 pr-3 whitespace-nowrap">{o.stored}</td>
                <td className={`py-1 whitespace-nowrap ${o.agrees ? '' : 'font-semibold text-bad'}`}>
                  {o.recomputed}
                  {o.agrees ? '' : ' (differs)'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <p className="text-xs text-ink-soft">
        This page shows the calculation only: no names, addresses or messages. Results are estimates; they do
        not replace a site investigation or a licensed professional's judgement under local codes.
      </p>
    </AuthPage>
  );
}

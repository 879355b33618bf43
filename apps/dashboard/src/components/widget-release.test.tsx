// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { RefusedOrigins, Role, Widget } from '@wickstone/contracts';
import { refreshCsrf } from '../lib/api';
import { sampleWidget } from '../testing/fixtures';
import { ReleaseSection } from './widget-release';
import { EmbedCodeSection } from './widget-embed';

/*
 * The integration screen's developer part (release, allowed and refused sites, key), rendered with
 * the real query client and API client; only `fetch` stands in for the server and records calls.
 */

const SITE = 'https://www.ashgrove-survey.example';
const FORGOTTEN = 'https://portal.ashgrove-survey.example';
const APP = 'https://app.wickstone.example';

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
const fieldError = (field: string, message: string) =>
  json(400, {
    error: {
      code: 'validation_failed',
      message: `Invalid request: check ${field}`,
      details: { fields: [{ field, message }] },
    },
  });

const widget: Widget = sampleWidget({
  status: 'live',
  allowedOrigins: [SITE],
  release: '0.3.0',
  publicKey: '988M-4JNV-N3F4-D01S-E',
  nextKeyKind: 'reference',
  embed: {
    scriptUrl: `${APP}/releases/0.3.0/wickstone-tube-rise.js`,
    integrity: 'sha384-abc',
    snippet: '<script async src="x"></script>',
    variants: {
      async: '<script async src="x"></script>',
      plain: '<script src="x"></script>',
      nonce: '<script async nonce="{{csp-nonce}}" src="x"></script>',
      heldCss: 'wickstone-widget[data-calculator="tube-rise"] { display: block; min-height: 1040px; }',
    },
    csp: [
      { directive: 'script-src', sources: ["'nonce-{{csp-nonce}}'", APP] },
      { directive: 'connect-src', sources: [APP] },
    ],
  },
});

interface Server {
  refused?: RefusedOrigins | 'fail' | 'wait';
  origins?: (origins: string[]) => Response;
  rotation?: (body: { oldKeyValidUntil: string }) => Response;
}

function stand(opts: Server) {
  const sent: { method: string; path: string; body: unknown }[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const path = String(input).replace('/api/v1', '');
    const method = init.method ?? 'GET';
    const body: unknown = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    if (method !== 'GET') sent.push({ method, path, body });
    if (path === '/auth/csrf') return json(200, { csrfToken: 'token-1' });
    if (path === '/releases') return json(200, { items: [] });
    if (path === '/orgs/1/widgets/7/refused-origins') {
      if (opts.refused === 'fail')
        return json(500, {
          error: { code: 'internal', message: 'Something failed on our side', details: null },
        });
      if (opts.refused === 'wait') return new Promise<Response>(() => undefined);
      return json(200, opts.refused ?? { days: 30, items: [] });
    }
    if (path === '/orgs/1/widgets/7/origins' && method === 'PUT')
      return opts.origins
        ? opts.origins((body as { origins: string[] }).origins)
        : json(200, { ...widget, allowedOrigins: (body as { origins: string[] }).origins });
    if (path === '/orgs/1/widgets/7/key-rotations' && method === 'POST')
      return opts.rotation
        ? opts.rotation(body as { oldKeyValidUntil: string })
        : json(404, { error: { code: 'not_found', message: 'Not found', details: null } });
    return json(404, { error: { code: 'not_found', message: 'Not found', details: null } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return sent;
}

function show(role: Role, w: Widget = widget) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter(
    [
      {
        path: '/',
        element: (
          <>
            <EmbedCodeSection widget={w} dirty={false} />
            <ReleaseSection orgId={1} widget={w} role={role} />
          </>
        ),
      },
    ],
    { initialEntries: ['/'] },
  );
  render(
    <QueryClientProvider client={client}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

beforeEach(async () => {
  stand({});
  await refreshCsrf();
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('integration screen: refused sites', { timeout: 30_000 }, () => {
  it('shows loading, then the empty state', async () => {
    stand({ refused: 'wait' });
    show('developer');
    expect(await screen.findByText('Loading refused sites…')).toBeTruthy();
    cleanup();
    stand({});
    show('developer');
    expect(await screen.findByText(/No page outside the allowed sites asked/)).toBeTruthy();
  });

  it('shows the error state with its message', async () => {
    stand({ refused: 'fail' });
    show('developer');
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Refused sites could not be loaded');
    expect(alert.textContent).toContain('Something failed on our side');
  });

  it('lists refused origins with counts and allows one in one click', async () => {
    const sent = stand({
      refused: {
        days: 30,
        items: [{ origin: FORGOTTEN, refusals: 12, lastDay: '2026-12-01', byDay: [] }],
      },
    });
    const user = userEvent.setup();
    show('developer');
    const list = await waitFor(() => {
      const el = document.querySelector('[data-refused-origins]');
      if (!el) throw new Error('not yet');
      return el as HTMLElement;
    });
    expect(list.textContent).toContain('refused 12 times');
    await user.click(within(list).getByRole('button', { name: /Allow this origin/ }));
    await waitFor(() =>
      expect(sent).toContainEqual({
        method: 'PUT',
        path: '/orgs/1/widgets/7/origins',
        body: { origins: [SITE, FORGOTTEN] },
      }),
    );
    expect(await screen.findByText('Allowed: its pages get the widget from now on.')).toBeTruthy();
  });

  it('gives a read-only analyst no buttons to change sites or keys', async () => {
    stand({});
    show('analyst');
    expect(
      await screen.findByText(/Owners, admins and developers see the sites the widget refused/),
    ).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Allow this/ })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Replace the key' })).toBeNull();
    expect(document.querySelector('[data-current-key]')?.textContent).toBe(widget.publicKey);
  });
});

describe('integration screen: allowed sites', { timeout: 30_000 }, () => {
  it('shows the server’s refusal of an origin with a path on the line typed', async () => {
    const sent = stand({
      origins: (origins) =>
        origins.length > 1
          ? fieldError('body.origins.1', 'Not an origin: use scheme://host[:port] with nothing after it')
          : json(200, widget),
    });
    const user = userEvent.setup();
    show('developer');
    await user.type(await screen.findByRole('textbox', { name: 'Add a site' }), `${FORGOTTEN}/contact`);
    await user.click(screen.getByRole('button', { name: 'Allow this site' }));
    expect(await screen.findByText(/Not an origin: use scheme/)).toBeTruthy();
    expect(sent.at(-1)?.body).toEqual({ origins: [SITE, `${FORGOTTEN}/contact`] });
  });

  it('shows a refusal of the whole list (too many origins)', async () => {
    stand({ origins: () => fieldError('body.origins', 'At most 20 origins') });
    const user = userEvent.setup();
    show('developer');
    await user.type(await screen.findByRole('textbox', { name: 'Add a site' }), FORGOTTEN);
    await user.click(screen.getByRole('button', { name: 'Allow this site' }));
    expect(await screen.findByText('At most 20 origins')).toBeTruthy();
  });

  it('removes a site', async () => {
    const sent = stand({});
    const user = userEvent.setup();
    show('developer');
    await user.click(await screen.findByRole('button', { name: `Remove ${SITE}` }));
    await waitFor(() => expect(sent.at(-1)).toMatchObject({ method: 'PUT', body: { origins: [] } }));
  });
});

describe('integration screen: key rotation and snippets', { timeout: 30_000 }, () => {
  it('rotates after a confirmation and shows both keys until the date', async () => {
    const until = new Date(Date.now() + 20 * 86_400_000).toISOString().slice(0, 10);
    const sent = stand({
      rotation: ({ oldKeyValidUntil }) =>
        json(201, {
          ...widget,
          publicKey: 'PEDJ-3CT1-CE02-93CA-A',
          previousKey: {
            publicKey: widget.publicKey,
            replacedAt: new Date().toISOString(),
            validUntil: `${oldKeyValidUntil}T23:59:59.000Z`,
            served: true,
          },
        }),
    });
    const user = userEvent.setup();
    show('developer');
    const date = await screen.findByLabelText(/Keep serving the current key through/);
    await user.clear(date);
    await user.type(date, until);
    await user.click(screen.getByRole('button', { name: 'Replace the key' }));
    expect(sent.filter((s) => s.path.endsWith('key-rotations'))).toEqual([]);
    await user.click(await screen.findByRole('button', { name: 'Replace it' }));
    await waitFor(() =>
      expect(sent).toContainEqual({
        method: 'POST',
        path: '/orgs/1/widgets/7/key-rotations',
        body: { oldKeyValidUntil: until },
      }),
    );
    expect(await screen.findByText(/New key PEDJ-3CT1-CE02-93CA-A/)).toBeTruthy();
  });

  it('shows a refused date under the date field', async () => {
    stand({ rotation: () => fieldError('body.oldKeyValidUntil', 'At most 90 days ahead') });
    const user = userEvent.setup();
    show('developer');
    await user.click(await screen.findByRole('button', { name: 'Replace the key' }));
    await user.click(await screen.findByRole('button', { name: 'Replace it' }));
    expect(await screen.findByText('At most 90 days ahead')).toBeTruthy();
  });

  it('shows both keys while the replaced one is served, and no second rotation', async () => {
    stand({});
    show(
      'developer',
      sampleWidget({
        ...widget,
        previousKey: {
          publicKey: 'wk_ashgrove000000000001',
          replacedAt: '2026-12-02T07:00:00.000Z',
          validUntil: '2026-12-20T00:00:00.000Z',
          served: true,
        },
      }),
    );
    const previous = await waitFor(() => {
      const el = document.querySelector('[data-previous-key]');
      if (!el) throw new Error('not yet');
      return el;
    });
    expect(previous.getAttribute('data-previous-key')).toBe('served');
    expect(previous.textContent).toContain('wk_ashgrove000000000001');
    expect(previous.textContent).toContain('served through 19 Dec 2026 (UTC)');
    expect(screen.queryByRole('button', { name: 'Replace the key' })).toBeNull();
  });

  it('switches between the snippet variants and shows the SRI hash and the CSP sources', async () => {
    stand({});
    const user = userEvent.setup();
    show('developer');
    const code = () => document.querySelector<HTMLTextAreaElement>('[data-embed-snippet]')?.value;
    expect(code()).toBe(widget.embed.variants.async);
    await user.click(screen.getByRole('radio', { name: 'Plain' }));
    expect(code()).toBe(widget.embed.variants.plain);
    await user.click(screen.getByRole('radio', { name: 'With a CSP nonce' }));
    expect(code()).toBe(widget.embed.variants.nonce);
    expect(document.querySelector('[data-held-css]')?.textContent).toBe(widget.embed.variants.heldCss);
    expect(document.querySelector('[data-sri]')?.textContent).toBe('sha384-abc');
    expect(document.querySelector('[data-csp]')?.textContent).toContain(`connect-src ${APP};`);
  });
});

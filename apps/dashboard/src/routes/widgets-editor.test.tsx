// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Widget } from '@wickstone/contracts';
import { refreshCsrf } from '../lib/api';
import { OrgContext } from '../lib/org-context';
import { sampleWidget } from '../testing/fixtures';
import { WidgetEditorPage } from './widgets-editor';

/*
 * The editor's save and discard flow, rendered in a DOM with the real query client, router and API
 * client; only `fetch` is a stand-in for the server, and it records what the editor sent.
 */

const saved: Widget = sampleWidget();

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });

interface Sent {
  method: string;
  path: string;
  body: unknown;
}

/** A stand-in server for one widget; `refuse` makes the next PATCH a 400 naming a field. */
function server(opts: { refuse?: { field: string; message: string } } = {}) {
  const sent: Sent[] = [];
  let current = saved;
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const path = String(input).replace('/api/v1', '');
    const method = init.method ?? 'GET';
    const body: unknown = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    if (method !== 'GET') sent.push({ method, path, body });
    if (path === '/auth/csrf') return json(200, { csrfToken: 'token-1' });
    if (path === '/orgs/1/widgets/7' && method === 'GET') return json(200, current);
    if (path === '/orgs/1/widgets/7' && method === 'PATCH') {
      if (opts.refuse) {
        return json(400, {
          error: {
            code: 'validation_failed',
            message: 'Invalid request',
            details: { fields: [{ field: `body.${opts.refuse.field}`, message: opts.refuse.message }] },
          },
        });
      }
      current = { ...current, ...(body as Partial<Widget>), updatedAt: '2026-12-02T09:30:00.000Z' };
      return json(200, current);
    }
    if (path.startsWith('/orgs/1/widgets/7/revisions')) return json(200, { items: [], total: 0 });
    return json(404, { error: { code: 'not_found', message: 'Not found', details: null } });
  });
  return { fetchMock, sent, patches: () => sent.filter((s) => s.method === 'PATCH') };
}

function renderEditor() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter([{ path: '/orgs/1/widgets/:widgetId', element: <WidgetEditorPage /> }], {
    initialEntries: ['/orgs/1/widgets/7'],
  });
  render(
    <QueryClientProvider client={client}>
      <OrgContext.Provider
        value={{ orgId: 1, organizationName: 'Brackenridge Ground', role: 'owner', userId: 3 }}
      >
        <RouterProvider router={router} />
      </OrgContext.Provider>
    </QueryClientProvider>,
  );
}

const saveState = () => document.querySelector('[data-save-state]')?.getAttribute('data-save-state');
const saveMessage = () => document.querySelector('[data-save-state]')?.textContent;

let api: ReturnType<typeof server>;
beforeEach(async () => {
  api = server();
  vi.stubGlobal('fetch', api.fetchMock);
  vi.stubGlobal('requestAnimationFrame', (f: FrameRequestCallback) => setTimeout(() => f(0), 0));
  await refreshCsrf();
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('widget editor: save and discard', { timeout: 30_000 }, () => {
  it('saves a changed name with PATCH and says when, leaving nothing unsaved', async () => {
    const user = userEvent.setup();
    renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    expect(saveState()).toBe('clean');
    expect(screen.getByRole('button', { name: 'Save changes' })).toHaveProperty('disabled', true);

    await user.clear(name);
    await user.type(name, 'Damp course check');
    expect(saveState()).toBe('dirty');
    expect(screen.getByText('Unsaved changes')).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(saveState()).toBe('ok'));
    expect(api.patches()).toHaveLength(1);
    expect(api.patches()[0]?.body).toMatchObject({ name: 'Damp course check' });
    expect(saveMessage()).toMatch(/^Saved at .+ The change is kept in the history\.$/);
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Damp course check');
    expect(screen.queryByRole('button', { name: 'Discard changes' })).toBeNull();
  });

  it('discards every unsaved change after asking once, and sends nothing', async () => {
    const user = userEvent.setup();
    renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    await user.type(name, ' (copy)');
    await user.click(screen.getByRole('radio', { name: /US customary/ }));
    expect(saveState()).toBe('dirty');

    await user.click(screen.getByRole('button', { name: 'Discard changes' }));
    const question = screen.getByRole('group', { name: 'Discard every unsaved change?' });
    // The first press only asks; "Keep" leaves the draft alone.
    await user.click(within(question).getByRole('button', { name: 'Keep' }));
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Rising damp check (copy)');

    await user.click(screen.getByRole('button', { name: 'Discard changes' }));
    await user.click(screen.getByRole('button', { name: 'Discard' }));
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Rising damp check');
    expect(screen.getByRole('radio', { name: /Metric \(SI\)/ })).toHaveProperty('checked', true);
    expect(saveState()).toBe('clean');
    expect(api.patches()).toHaveLength(0);
  });

  it('sends nothing while the draft has a problem, and lists it', async () => {
    const user = userEvent.setup();
    renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    await user.clear(name);
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(saveState()).toBe('bad');
    expect(saveMessage()).toBe('Not saved: one setting needs attention.');
    expect(within(screen.getAllByRole('alert')[0]!).getByText(/Fix these before saving/)).toBeTruthy();
    expect(name.getAttribute('aria-invalid')).toBe('true');
    expect(api.patches()).toHaveLength(0);
  });

  it('keeps the draft and shows the server’s refusal beside the field', async () => {
    api = server({ refuse: { field: 'name', message: 'Another widget has this name' } });
    vi.stubGlobal('fetch', api.fetchMock);
    const user = userEvent.setup();
    renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    await user.type(name, ' 2');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(saveState()).toBe('bad'));
    expect(saveMessage()).toBe('Not saved: the server refused one setting. Your changes are still here.');
    expect(screen.getAllByText('Another widget has this name').length).toBeGreaterThan(0);
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Rising damp check 2');
    // The message goes once the value it was about changes.
    await user.type(name, '3');
    expect(screen.queryAllByText('Another widget has this name')).toHaveLength(0);
  });
});

// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, render, screen, waitFor, within } from '@testing-library/react';
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

function renderEditor(at = '/orgs/1/widgets/7') {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const router = createMemoryRouter(
    [
      { path: '/orgs/1/widgets/:widgetId', element: <WidgetEditorPage /> },
      { path: '/orgs/1/widgets', element: <p>All widgets</p> },
    ],
    { initialEntries: [at] },
  );
  render(
    <QueryClientProvider client={client}>
      <OrgContext.Provider
        value={{ orgId: 1, organizationName: 'Brackenridge Ground', role: 'owner', userId: 3 }}
      >
        <RouterProvider router={router} />
      </OrgContext.Provider>
    </QueryClientProvider>,
  );
  return router;
}

/** The section the address names, and the state each contents entry shows. */
const sectionParam = (router: ReturnType<typeof renderEditor>) =>
  new URLSearchParams(router.state.location.search).get('section');
const stateOf = (id: string) =>
  document.querySelector(`[data-section-link="${id}"]`)?.getAttribute('data-section-state');
const contentsLink = (name: RegExp) =>
  within(screen.getByRole('navigation', { name: 'Editor sections' })).getByRole('link', { name });

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
    await user.click(contentsLink(/Units/));
    await user.click(await screen.findByRole('radio', { name: /US customary/ }));
    expect(saveState()).toBe('dirty');

    await user.click(screen.getByRole('button', { name: 'Discard changes' }));
    const question = screen.getByRole('group', { name: 'Discard every unsaved change?' });
    // The first press only asks; "Keep" leaves the draft alone.
    await user.click(within(question).getByRole('button', { name: 'Keep' }));
    expect(screen.getByRole('radio', { name: /US customary/ })).toHaveProperty('checked', true);

    await user.click(screen.getByRole('button', { name: 'Discard changes' }));
    await user.click(screen.getByRole('button', { name: 'Discard' }));
    expect(screen.getByRole('radio', { name: /Metric \(SI\)/ })).toHaveProperty('checked', true);
    await user.click(contentsLink(/Name and status/));
    expect(await screen.findByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Rising damp check');
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

describe('widget editor: sections worked through one at a time', { timeout: 30_000 }, () => {
  it('shows one section at its own address, moves with next and previous, and keeps the draft', async () => {
    const user = userEvent.setup();
    const router = renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    expect(sectionParam(router)).toBeNull();
    // Only the first section's fields are on the page.
    expect(screen.queryByRole('radio', { name: /US customary/ })).toBeNull();
    expect(document.querySelector('[data-section-title-block]')?.textContent).toMatch(
      /^Section01 of 11State/,
    );

    await user.type(name, ' 2');
    await user.click(screen.getByRole('link', { name: /Next →\s*02 Inputs/ }));
    expect(sectionParam(router)).toBe('inputs');
    expect(screen.queryByRole('textbox', { name: 'Name' })).toBeNull();
    expect(document.querySelector('[data-editor-section]')?.getAttribute('data-editor-section')).toBe(
      'inputs',
    );
    expect(document.getElementById('widget-inputs')).not.toBeNull();
    // Focus goes to the new section's title block, so a screen reader hears where it is.
    await waitFor(() =>
      expect(document.activeElement?.getAttribute('data-section-title-block')).toBe('inputs'),
    );

    await user.click(screen.getByRole('link', { name: /Next →\s*03 Units/ }));
    expect(sectionParam(router)).toBe('units');
    await user.click(screen.getByRole('link', { name: /← Previous\s*02 Inputs/ }));
    await user.click(screen.getByRole('link', { name: /← Previous\s*01 Name and status/ }));
    expect(sectionParam(router)).toBe('name');
    // One draft for every section: the name typed before leaving is still there, unsaved.
    expect(screen.getByRole('textbox', { name: 'Name' })).toHaveProperty('value', 'Rising damp check 2');
    expect(saveState()).toBe('dirty');
    expect(api.patches()).toHaveLength(0);
  });

  it('opens the section an address names, and the first for an unknown one', async () => {
    renderEditor('/orgs/1/widgets/7?section=sheet');
    expect(await screen.findByRole('radio', { name: /US Letter/ })).toBeTruthy();
    expect(screen.getByRole('link', { current: 'step' }).getAttribute('data-section-link')).toBe('sheet');
    cleanup();
    renderEditor('/orgs/1/widgets/7?section=nowhere');
    expect(await screen.findByRole('textbox', { name: 'Name' })).toBeTruthy();
  });

  it('marks each section changed, done or needing a fix in the contents', async () => {
    const user = userEvent.setup();
    renderEditor();
    const name = await screen.findByRole('textbox', { name: 'Name' });
    expect(stateOf('name')).toBe('here');
    expect(stateOf('units')).toBe('open');

    await user.click(contentsLink(/Inputs/));
    await user.click(contentsLink(/Units/));
    // Opened and left with nothing to fix: done. The one shown is being worked on.
    expect(stateOf('inputs')).toBe('done');
    expect(stateOf('name')).toBe('done');
    expect(stateOf('units')).toBe('here');
    expect(document.querySelector('[data-current-state]')?.textContent).toBe('Open now');
    await user.click(screen.getByRole('radio', { name: /US customary/ }));
    expect(stateOf('units')).toBe('changed');
    expect(document.querySelector('[data-current-state]')?.textContent).toBe('Changed, not saved');
    expect(stateOf('look')).toBe('open');

    await user.click(contentsLink(/Name and status/));
    await user.clear(screen.getByRole('textbox', { name: 'Name' }));
    expect(name.isConnected).toBe(false);
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(stateOf('name')).toBe('errors');
    expect(stateOf('units')).toBe('changed');
    expect(api.patches()).toHaveLength(0);

    // Put back as saved, the section is no longer changed.
    await user.type(screen.getByRole('textbox', { name: 'Name' }), 'Rising damp check');
    expect(stateOf('name')).toBe('here');
  });

  it('takes a refused save to the section and field the server named', async () => {
    api = server({ refuse: { field: 'settings.cautions', message: 'Too long for this plan' } });
    vi.stubGlobal('fetch', api.fetchMock);
    const user = userEvent.setup();
    const router = renderEditor();
    await user.type(await screen.findByRole('textbox', { name: 'Name' }), ' 2');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(sectionParam(router)).toBe('cautions'));
    const field = await screen.findByRole('textbox', { name: "The firm's own cautions" });
    await waitFor(() => expect(document.activeElement).toBe(field));
    expect(field.getAttribute('aria-invalid')).toBe('true');
    expect(stateOf('cautions')).toBe('errors');
    expect(stateOf('name')).toBe('changed');
  });

  it('takes a save the draft refuses back to the field, from any section, and the summary links there too', async () => {
    const user = userEvent.setup();
    const router = renderEditor();
    await user.clear(await screen.findByRole('textbox', { name: 'Name' }));
    await user.click(contentsLink(/Look/));
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(sectionParam(router)).toBe('name'));
    const name = screen.getByRole('textbox', { name: 'Name' });
    await waitFor(() => expect(document.activeElement).toBe(name));

    await user.click(contentsLink(/Sites/));
    const summary = screen.getAllByRole('alert')[0]!;
    await user.click(within(summary).getByRole('link', { name: 'Name' }));
    expect(sectionParam(router)).toBe('name');
    await waitFor(() => expect(document.activeElement).toBe(screen.getByRole('textbox', { name: 'Name' })));
  });

  it('asks before leaving the widget with unsaved changes, but not between its sections', async () => {
    const user = userEvent.setup();
    const router = renderEditor();
    await user.type(await screen.findByRole('textbox', { name: 'Name' }), ' 2');
    await user.click(contentsLink(/Calculation sheet/));
    expect(screen.queryByText(/Leave without saving them\?/)).toBeNull();
    await act(() => router.navigate('/orgs/1/widgets'));
    expect(screen.getByText('This widget has unsaved changes. Leave without saving them?')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Stay here' }));
    expect(router.state.location.pathname).toBe('/orgs/1/widgets/7');
    await act(() => router.navigate('/orgs/1/widgets'));
    await user.click(screen.getByRole('button', { name: 'Leave without saving' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/orgs/1/widgets'));
  });
});

import { useEffect, useId, useRef, useState } from 'react';
import { Link, useLocation } from 'react-router';
import { can, type MeResponse } from '@wickstone/contracts';
import { roleLabel } from '../lib/labels';
import { orgNav, orgPath } from '../nav';

/**
 * The organisation name in the header; with several memberships it opens a short list of links.
 * Links rather than a select, because a select moves on every arrow key press.
 */
export function OrgSwitcher({ me, orgId, section }: { me: MeResponse; orgId: number; section: string }) {
  // Open on the page it was opened on: navigating anywhere closes it.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const listId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const location = useLocation();
  const open = openOn === location.pathname;
  const current = me.memberships.find((m) => m.organizationId === orgId);

  // Close on Escape (focus back to the button) and on a click elsewhere.
  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpenOn(null);
        buttonRef.current?.focus();
      }
    };
    const onClick = (e: MouseEvent) => {
      if (!rootRef.current?.contains(e.target as Node)) setOpenOn(null);
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('mousedown', onClick);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('mousedown', onClick);
    };
  }, [open]);

  if (me.memberships.length < 2) {
    return <span className="block min-w-0 truncate font-bold">{current?.organizationName}</span>;
  }
  // In another organisation, stay on the same screen when the role there allows it.
  const entry = orgNav.find((n) => n.path === section);
  return (
    <div ref={rootRef} className="relative min-w-0 flex-1 sm:flex-none">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={listId}
        onClick={() => setOpenOn(open ? null : location.pathname)}
        className="flex w-full min-w-0 items-center gap-2 rounded-sm border border-line-strong px-2 py-0.5 text-left font-bold text-ink hover:bg-paper-deep sm:w-auto sm:max-w-md"
      >
        <span className="sr-only">Organisation: </span>
        <span className="truncate">{current?.organizationName}</span>
        <span
          aria-hidden="true"
          className={`ml-auto text-sm transition-transform ${open ? 'rotate-180' : ''}`}
        >
          ▾
        </span>
      </button>
      <div
        id={listId}
        hidden={!open}
        className="absolute left-0 z-20 mt-2 w-72 max-w-[calc(100vw-2rem)] rounded-lg border border-line bg-card py-1 text-ink shadow-lg"
      >
        <p className="px-4 pt-2 pb-1 text-xs font-semibold tracking-wider text-ink-soft uppercase">
          Switch organisation
        </p>
        <ul>
          {me.memberships.map((m) => {
            const keep = entry && can(m.role, entry.permission) ? section : '';
            const here = m.organizationId === orgId;
            return (
              <li key={m.organizationId}>
                <Link
                  to={orgPath(m.organizationId, keep)}
                  aria-current={here ? 'true' : undefined}
                  className={`block px-4 py-2 hover:bg-paper ${here ? 'bg-brand-tint/60' : ''}`}
                >
                  <span className="block font-semibold">{m.organizationName}</span>
                  <span className="block text-sm text-ink-soft">{roleLabel[m.role]}</span>
                </Link>
              </li>
            );
          })}
        </ul>
      </div>
    </div>
  );
}

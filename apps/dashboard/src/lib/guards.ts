import { redirect, type LoaderFunctionArgs } from 'react-router';
import { queryClient } from './query-client';
import { meQuery } from '../queries/session';
import { homeFor, loginPath, safeNext } from './session';

/** Signed-out visitors of a signed-in page go to sign-in, and come back here afterwards. */
export async function requireSession({ request }: LoaderFunctionArgs) {
  const me = await queryClient.ensureQueryData({ ...meQuery(), revalidateIfStale: true });
  if (!me) {
    const url = new URL(request.url);
    throw redirect(loginPath(url.pathname + url.search));
  }
  return null;
}

/** The sign-in and sign-up pages are skipped by someone already signed in. */
export async function skipWhenSignedIn({ request }: LoaderFunctionArgs) {
  let me;
  try {
    me = await queryClient.ensureQueryData(meQuery());
  } catch {
    // The server is unreachable: show the page; its form will say so when used.
    return null;
  }
  if (me) throw redirect(safeNext(new URL(request.url).searchParams.get('next')) ?? homeFor(me));
  return null;
}

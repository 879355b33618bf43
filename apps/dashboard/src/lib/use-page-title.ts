import { useEffect } from 'react';

/** Each screen names itself in the tab and in the history list. */
export function usePageTitle(title: string) {
  useEffect(() => {
    document.title = `${title} · Wickstone`;
  }, [title]);
}

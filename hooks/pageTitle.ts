// Every page is titled after what it shows ("Clamshell headshot · Falloff"), so a tab, a history entry and a
// screen reader's announcement say where one is (WCAG 2.4.2). Web only; native has its own headers.
import { useEffect } from 'react';
import { Platform } from 'react-native';

const pageTitle = (what: string | null | undefined) => (what ? `${what} · Falloff` : 'Falloff');

export function usePageTitle(what: string | null | undefined) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof document === 'undefined') return;
    document.title = pageTitle(what);
  }, [what]);
}

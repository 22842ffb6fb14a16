// Autosave for the editor: changes are sent to the server a moment after they stop (debounced), one save at
// a time, each naming the version it started from. The cached setup is updated at once (optimistic); a lost
// connection retries with back-off; a save that crossed someone else's is never forced: the editor shows
// the conflict and lets the user choose.
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { SetupDetail } from '../model/api';
import type { SetupDocument } from '../model/document';
import { ApiRequestError, api } from './api';
import { conflictOf, setupKeys, useSaveSetup } from './setups';

export type SaveState =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'offline'; retryInMs: number }
  | { kind: 'conflict'; theirs: ServerSetup }
  | { kind: 'failed'; message: string };

export type ServerSetup = SetupDetail;

type Fields = { document?: SetupDocument; title?: string; notes?: string };

export const AUTOSAVE_DELAY_MS = 700;

export function useSetupSync(setup: ServerSetup | undefined) {
  const qc = useQueryClient();
  const [state, setState] = useState<SaveState>({ kind: 'saved', at: null });
  const version = useRef(setup?.version ?? 0);
  const pending = useRef<Fields>({});
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const inFlight = useRef(false);
  const backoff = useRef(0);
  const id = setup?.id;
  const mutation = useSaveSetup(id ?? '');

  useEffect(() => {
    if (setup && !inFlight.current && !Object.keys(pending.current).length) version.current = setup.version;
  }, [setup]);

  const flush = useCallback(async () => {
    if (!id || inFlight.current) return;
    const fields = pending.current;
    if (!Object.keys(fields).length) return;
    pending.current = {};
    inFlight.current = true;
    setState({ kind: 'saving' });
    try {
      // The mutation updates the cached setup at once (optimistic) and the lists after.
      const saved = await mutation.mutateAsync({ version: version.current, ...fields });
      version.current = saved.version;
      backoff.current = 0;
      setState(Object.keys(pending.current).length ? { kind: 'pending' } : { kind: 'saved', at: new Date() });
    } catch (e) {
      const theirs = conflictOf(e);
      if (e instanceof ApiRequestError && e.status === 409) {
        // Keep what was not saved so "keep mine as a copy" still has it.
        pending.current = { ...fields, ...pending.current };
        setState(theirs ? { kind: 'conflict', theirs: { ...theirs, document: theirs.document } } : { kind: 'failed', message: e.message });
      } else if (e instanceof ApiRequestError && e.status < 500) {
        setState({ kind: 'failed', message: e.message });
      } else {
        pending.current = { ...fields, ...pending.current };
        backoff.current = Math.min(30_000, backoff.current ? backoff.current * 2 : 2000);
        setState({ kind: 'offline', retryInMs: backoff.current });
        timer.current = setTimeout(() => void flush(), backoff.current);
      }
    } finally {
      inFlight.current = false;
    }
    if (Object.keys(pending.current).length && !timer.current) schedule();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [id, mutation.mutateAsync]);

  const schedule = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      timer.current = null;
      void flush();
    }, AUTOSAVE_DELAY_MS);
  }, [flush]);

  /** Queue a change for saving. */
  const save = useCallback(
    (f: Fields) => {
      pending.current = { ...pending.current, ...f };
      // Called on every drag frame: only a change of state re-renders.
      setState((s) => (s.kind === 'conflict' || s.kind === 'offline' || s.kind === 'pending' ? s : { kind: 'pending' }));
      if (state.kind !== 'conflict') schedule();
    },
    [id, qc, schedule, state.kind],
  );

  /** After a conflict: take the server's copy (drops what was not saved). */
  const acceptTheirs = useCallback((theirs: ServerSetup) => {
    pending.current = {};
    version.current = theirs.version;
    if (id) qc.setQueryData(setupKeys.detail(id), theirs);
    setState({ kind: 'saved', at: new Date() });
  }, [id, qc]);

  /** After a conflict: save what was not saved as a new setup; returns it. */
  const keepMineAsCopy = useCallback(
    async (doc: SetupDocument, title: string) => {
      const copy = await api<ServerSetup>('/setups', { method: 'POST', body: { studioId: setup?.studioId, title: `${title} (my version)`, document: doc, notes: pending.current.notes ?? setup?.notes ?? '' } });
      pending.current = {};
      void qc.invalidateQueries({ queryKey: setupKeys.lists() });
      return copy;
    },
    [qc, setup?.studioId, setup?.notes],
  );

  // Save what is pending before the page goes away.
  useEffect(() => {
    if (typeof window === 'undefined' || !window.addEventListener) return;
    const onHide = () => {
      if (!id || !Object.keys(pending.current).length) return;
      void fetch(`/api/setups/${id}`, { method: 'PUT', keepalive: true, credentials: 'same-origin', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ version: version.current, ...pending.current }) });
    };
    window.addEventListener('pagehide', onHide);
    return () => window.removeEventListener('pagehide', onHide);
  }, [id]);

  useEffect(() => () => void (timer.current && clearTimeout(timer.current)), []);

  return { state, save, acceptTheirs, keepMineAsCopy, flush };
}

export function saveStateLabel(s: SaveState): string {
  switch (s.kind) {
    case 'saved':
      return s.at ? 'Saved' : 'Up to date';
    case 'pending':
      return 'Unsaved changes';
    case 'saving':
      return 'Saving…';
    case 'offline':
      return `Offline — will retry in ${Math.round(s.retryInMs / 1000)} s`;
    case 'conflict':
      return 'Changed elsewhere';
    case 'failed':
      return `Not saved: ${s.message}`;
  }
}

// The editor's autosave (canvas/editor/persist.ts) talks to the server through this: the same API client as
// everything else, for the saves, the page-close save (keepalive) and "keep mine as a copy"; and it keeps
// TanStack Query's cached copy of the setup in step with what the editor sends.
import type { QueryClient } from '@tanstack/react-query';
import type { PersistClient, PersistOptions } from '../canvas/editor/persist';
import type { SetupDetail } from '../model/api';
import { call } from './api';
import { documentParser, setupKeys } from './setups';

export const persistClient: PersistClient = {
  save: (id, body, opts) => call('updateSetup', { params: { id }, body, keepalive: opts?.keepalive, signal: opts?.signal, headers: opts?.idempotencyKey ? { 'idempotency-key': opts.idempotencyKey } : undefined }),
  createCopy: (body) => call('createSetup', { body }),
};

/** Cache hooks for a persist: the detail shows each save as it is sent; lists and history refresh after. */
export function persistCacheHooks(qc: QueryClient, id: string): Pick<PersistOptions, 'onSending' | 'onSaved' | 'onReplaced'> {
  return {
    onSending: (changes) => qc.setQueryData<SetupDetail>(setupKeys.detail(id), (old) => (old ? { ...old, ...changes } : old)),
    onSaved: (saved) => {
      qc.setQueryData<SetupDetail>(setupKeys.detail(id), (old) => (old ? { ...old, ...saved } : old));
      void qc.invalidateQueries({ queryKey: setupKeys.lists() });
      void qc.invalidateQueries({ queryKey: setupKeys.history(id) });
    },
    // The document model comes with the plan screens (hooks/setups.ts), already loaded when an editor is open.
    onReplaced: (theirs) => {
      void documentParser().then((parseDocument) => {
        qc.setQueryData(setupKeys.detail(id), { ...theirs, document: parseDocument(theirs.document) });
        void qc.invalidateQueries({ queryKey: setupKeys.lists() });
      });
    },
  };
}

// A react-hook-form resolver whose zod schema (model/forms.ts, the same one the server checks the body with)
// arrives with the first check, so zod stays out of the signed-out pages' first download. The chunk is asked
// for as soon as the visitor touches or types on the page (useWarmForms), well before a submit needs it.
import { useEffect } from 'react';
import type { FieldValues, Resolver } from 'react-hook-form';

type Schemas = typeof import('./formSchemas');
type Schema = Parameters<Schemas['zodResolver']>[0];

let loading: Promise<Schemas> | null = null;
/** Loads the schemas' chunk once (again after a failed load, e.g. without signal). */
export function loadFormSchemas(): Promise<Schemas> {
  loading ??= import('./formSchemas').catch((err: unknown) => {
    loading = null;
    throw err;
  });
  return loading;
}

/** `zodResolver(pick(schemas))`, with the schemas loaded on the first check (`Out`: the parsed values). */
export function lazyResolver<T extends FieldValues, Out = T>(pick: (s: Schemas) => Schema): Resolver<T, unknown, Out> {
  return async (values, context, options) => {
    const s = await loadFormSchemas();
    return (s.zodResolver(pick(s)) as unknown as Resolver<T, unknown, Out>)(values, context, options);
  };
}

/** Starts loading the schemas at the page's first pointer press, key or focus (web), or at once elsewhere. */
export function useWarmForms() {
  useWarmOnTouch(loadFormSchemas);
}

/** Calls `load` (once) at the page's first pointer press, key or focus on the web, or at once elsewhere. */
export function useWarmOnTouch(load: () => Promise<unknown>) {
  useEffect(() => {
    if (typeof window === 'undefined' || typeof window.addEventListener !== 'function') {
      void load().catch(() => {});
      return;
    }
    const events = ['pointerdown', 'keydown', 'focusin'] as const;
    const warm = () => {
      stop();
      void load().catch(() => {});
    };
    const stop = () => events.forEach((e) => window.removeEventListener(e, warm, true));
    events.forEach((e) => window.addEventListener(e, warm, { capture: true, passive: true }));
    return stop;
  }, [load]);
}

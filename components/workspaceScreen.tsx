// A screen from components/workspace.ts (or the read-only link's, components/shareScreen.ts), loaded when a
// route first shows it (see there why they are together). The workspace always loads after the share screen's
// chunk, which holds what the two share (scripts/chunkTiers.cjs).
import { Suspense, lazy, type ComponentProps, type ComponentType } from 'react';
import { startMeterWorker } from '../canvas/meter/warmWorker';
import { Loading } from './Loading';
import { SharedShell } from './SharedShell';

type Workspace = typeof import('./workspace');
type ScreenName = { [K in keyof Workspace]: Workspace[K] extends ComponentType<never> ? K : never }[keyof Workspace];

/** The lower tier first, then the workspace: its modules expect the lower tier's to be defined. Once: a route
 *  may start it early (`preloadWorkspace`), and the screen's lazy component then takes the same promise. A
 *  `falloff:workspace` mark says when the workspace's modules were evaluated. */
let workspace: Promise<Workspace> | null = null;
/** Whether the meter's worker starts once the chunks are in (preloadWorkspace with `meter`). */
let meterWorkerWanted = false;
const loadWorkspace = (): Promise<Workspace> =>
  (workspace ??= import('./shareScreen')
    .then((m) => m.shareModules())
    .then(() => {
      // The worker's script (~130 KB sent) downloads now, when the plan chunks are in, not beside them (on a
      // slow line it would hold them up), while this thread evaluates the workspace and renders the screen.
      if (meterWorkerWanted) startMeterWorker();
      return import('./workspace');
    })
    .then((w) => {
      if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark('falloff:workspace');
      return w;
    })
    .catch((err: unknown) => {
      workspace = null;
      throw err;
    }));

/** Starts loading and evaluating the plan screens now (a route whose data is still on its way: the editor's
 *  workspace chunk then evaluates while its setup downloads, not after). `meter`: the screen reads the live
 *  meter at once (the editor), so the meter's Web Worker starts once the chunks are in (canvas/meter/warmWorker.ts),
 *  warm by the time the setup is shown. Only while the chunks load: once they are in, the screen's engine starts
 *  its own worker when it opens (a route calls this on every render; an early worker nobody took would idle). */
export function preloadWorkspace(o: { meter?: boolean } = {}) {
  if (o.meter && !workspace) meterWorkerWanted = true;
  void loadWorkspace().catch(() => {});
}

function suspended<P extends object>(Screen: ComponentType<P>, name: string, Fallback: ComponentType = Loading) {
  function WorkspaceScreen(props: P) {
    return (
      <Suspense fallback={<Fallback />}>
        <Screen {...props} />
      </Suspense>
    );
  }
  WorkspaceScreen.displayName = `Workspace(${name})`;
  return WorkspaceScreen;
}

export function workspaceScreen<K extends ScreenName>(name: K) {
  type Props = ComponentProps<Workspace[K]> & object;
  const Screen = lazy(() => loadWorkspace().then((m) => ({ default: m[name] as unknown as ComponentType<Props> })));
  return suspended<Props>(Screen, name);
}

/** The read-only link's screen: its own chunk, without the editor's. */
export function sharedSetupScreen() {
  type Props = ComponentProps<import('./shareScreen').ShareModules['SharedSetupScreen']>;
  const Screen = lazy(() =>
    import('./shareScreen')
      .then((m) => m.shareModules())
      .then((m) => {
        // The meter's worker starts now, while the setup is still on its way (its script is large).
        m.warmMeterEngine();
        return { default: m.SharedSetupScreen };
      }),
  );
  // Until the chunk has arrived, the page's frame with a line of words (the page's first paint).
  return suspended<Props>(Screen, 'SharedSetupScreen', SharedShell);
}

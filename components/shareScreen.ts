// The read-only link's screen and the setup document's parser: a chunk of its own, loaded before
// components/workspace.ts whenever that loads (components/workspaceScreen.tsx, hooks/setups.ts). The plan,
// the meter and the document model live here, so the share page gets them without the editor, classes or crew
// sheets; the build keeps what both need in this chunk rather than in the one every page downloads
// (scripts/chunkTiers.cjs).
//
// Loading the chunk evaluates nothing but this file: `shareModules()` then evaluates the chunk's modules in
// steps, each in a task of its own (a MessageChannel message between steps), leaving a User Timing mark
// `falloff:share i/n` per step. In one go they were the share page's and the editor's longest task at start
// (0.4–0.55 s on the phone profile: zod and the document's schemas, culori, the calc and the plan). Steps are
// plain `require`s of modules in this chunk (nothing more is fetched); each evaluates only what the earlier
// ones have not. The tests' loader cannot `require` TypeScript and gets components/shareScreenTogether.ts.
import type { ShareModules } from './shareScreenTypes';

export type { ShareModules } from './shareScreenTypes';

// Our own modules only: a library required by name here would resolve through its package's `require`
// condition, which for zod is a second, CommonJS copy (our modules import its ES build).
/* eslint-disable @typescript-eslint/no-require-imports */
const steps: (() => unknown)[] = [
  () => require('../model/text'), // zod
  () => require('../calc/colour'), // culori
  () => require('../model/document'), // the document's schemas
  () => require('../calc'),
  () => require('../canvas/PlanCanvas'),
  () => require('./crew/SharedSetupScreen'),
];
/* eslint-enable @typescript-eslint/no-require-imports */

/** Runs `fn` in a task of its own, after whatever the browser has queued (input, paint). */
function nextTask(fn: () => void) {
  if (typeof MessageChannel === 'function') {
    const ch = new MessageChannel();
    ch.port1.onmessage = () => {
      ch.port1.close();
      fn();
    };
    ch.port2.postMessage(null);
  } else setTimeout(fn, 0);
}

let loaded: Promise<ShareModules> | null = null;
/** The screen and the parser, once every step has run (the steps run once). */
export function shareModules(): Promise<ShareModules> {
  loaded ??= new Promise<ShareModules>((resolve, reject) => {
    const run = (i: number) => {
      try {
        steps[i]!();
        if (typeof performance !== 'undefined' && typeof performance.mark === 'function') performance.mark(`falloff:share ${i + 1}/${steps.length}`);
        if (i + 1 < steps.length) return nextTask(() => run(i + 1));
        /* eslint-disable @typescript-eslint/no-require-imports */
        resolve({
          SharedSetupScreen: (require('./crew/SharedSetupScreen') as typeof import('./crew/SharedSetupScreen')).SharedSetupScreen,
          parseDocument: (require('../model/document') as typeof import('../model/document')).parseDocument,
          warmMeterEngine: (require('../canvas/meter/engine') as typeof import('../canvas/meter/engine')).warmMeterEngine,
        });
        /* eslint-enable @typescript-eslint/no-require-imports */
      } catch (err) {
        loaded = null;
        reject(err);
      }
    };
    run(0);
  });
  return loaded;
}

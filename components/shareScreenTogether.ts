// The share chunk's two exports, imported together: what the tests' module loader gets for
// components/shareScreen.ts (tests/setup/components.config.ts), since it cannot `require` our TypeScript. The
// app's builds evaluate the same modules in steps (components/shareScreen.ts).
import { warmMeterEngine } from '../canvas/meter/engine';
import { parseDocument } from '../model/document';
import { SharedSetupScreen } from './crew/SharedSetupScreen';
import type { ShareModules } from './shareScreenTypes';

export function shareModules(): Promise<ShareModules> {
  return Promise.resolve({ SharedSetupScreen, parseDocument, warmMeterEngine });
}

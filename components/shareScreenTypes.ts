// What the share chunk (components/shareScreen.ts) gives once its modules have been evaluated.
import type { warmMeterEngine } from '../canvas/meter/engine';
import type { parseDocument } from '../model/document';
import type { SharedSetupScreen } from './crew/SharedSetupScreen';

export type ShareModules = { SharedSetupScreen: typeof SharedSetupScreen; parseDocument: typeof parseDocument; warmMeterEngine: typeof warmMeterEngine };

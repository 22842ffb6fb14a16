// The request thread's side of the exports: each call runs its task on the worker pool (server/pool.ts).
import type { DaySheetInput, SheetInput } from './pdf';
import type { SetupDocument } from '../../model/document';
import type { Units } from '../../model/units';
import { asBuffer, runTask } from '../pool';

/** The module the export tasks live in (server/export/tasks.ts). */
const EXPORT_TASKS = 'server/export/tasks.ts';

export const planPngOnPool = async (a: { doc: SetupDocument; units: Units; widthPx: number }) => asBuffer(await runTask<Uint8Array>(EXPORT_TASKS, 'planPngTask', a, 'the plan PNG'));
export const planSvgOnPool = (a: { doc: SetupDocument; units: Units; widthPx: number }) => runTask<string>(EXPORT_TASKS, 'planSvgTask', a, 'the plan SVG');
export const crewSheetOnPool = async (input: SheetInput) => asBuffer(await runTask<Uint8Array>(EXPORT_TASKS, 'crewSheetTask', input, 'the crew sheet'));
export const daySheetOnPool = async (input: DaySheetInput) => asBuffer(await runTask<Uint8Array>(EXPORT_TASKS, 'daySheetTask', input, 'the day sheets'));

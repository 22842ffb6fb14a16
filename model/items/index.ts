// Every kind of plan item, in kit-palette order. The document's item union (model/document.ts), the palette,
// the inspector and the meter's scene are all derived from this list. Adding a kind: its module here plus its
// glyph in drawing/glyphs.ts (the typed maps fail to compile until both exist).
import { arrowKind, noteKind, tapeKind } from './annotation';
import { cameraKind } from './camera';
import { lightKind } from './light';
import { propKind } from './prop';
import { flagKind, reflectorKind, scrimKind, vflatKind } from './shaper';
import { subjectKind } from './subject';
import { wallKind } from './wall';

export const kindList = [subjectKind, cameraKind, lightKind, reflectorKind, flagKind, vflatKind, scrimKind, wallKind, propKind, noteKind, tapeKind, arrowKind] as const;

type Schemas<L extends readonly { schema: unknown }[]> = { -readonly [I in keyof L]: L[I]['schema'] };
/** The item schemas as a tuple, for the document's discriminated union. */
export const itemSchemas = kindList.map((k) => k.schema) as unknown as Schemas<typeof kindList>;

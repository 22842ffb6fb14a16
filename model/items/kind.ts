// What one kind of plan item is, in one place: its schema, how a new one is made (the only place its defaults
// live besides the schema's own), its name and palette group, its geometry for hit testing, what it gives the
// meter, its crew-sheet line and its inspector fields. Each model/items/<kind>.ts exports one of these (the
// shapers, four), and model/items/index.ts lists them; the document's union, the palette, the inspector and
// the meter's scene are derived from that list. Its look on the plan is drawing/glyphs.ts.
import type { z } from 'zod';
import type { FlagInput, LightInput, SurfaceInput } from '../../calc';
import type { FieldSpec } from '../fields';
import type { Point } from '../geometry';
import type { Units } from '../units';

type KindGroup = 'room' | 'people' | 'camera' | 'light' | 'shaper' | 'note';

/** What an item gives the meter's scene. */
type MeterPart = { light: LightInput } | { surface: SurfaceInput } | { flag: FlagInput };

type ItemLike = { id: string; kind: string; label: string; locked: boolean };

export type KindDef<S extends z.ZodType<ItemLike>> = {
  kind: z.infer<S>['kind'];
  schema: S;
  /** The name shown in the kit palette and the inspector. */
  label: string;
  group: KindGroup;
  /**
   * Geometry: a point item sits at (x, y) inside a circle of `radiusM`; a segment runs from a to b; a panel
   * stands upright at (x, y), `widthM` wide across its rotation. Used for moving, hit testing and selection.
   */
  shape: 'point' | 'segment' | 'panel';
  radiusM: number;
  /** The field the item points along and its inspector label, for items that point. */
  angle?: { key: 'aimDeg' | 'facingDeg' | 'rotationDeg'; label: string };
  /** Raw fields of a new item dropped at `at` (parsed with the schema, which fills in the rest). */
  create: (at: Point) => Record<string, unknown>;
  /** The kind's own inspector fields (label, position, angle and lock are common to all). */
  fields: readonly FieldSpec<z.infer<S>>[];
  /** Fields changed most often, shown first, before the label and position (a light's power, modifier, gel). */
  lead?: readonly FieldSpec<z.infer<S>>[];
  /** What it adds to the meter's scene (nothing for items that do not change the light). */
  meter?: (item: z.infer<S>) => MeterPart | null;
  /** Its line in the crew sheet's kit list ("silver reflector, 1 m × 1 m …"), if it has one. */
  gear?: (item: z.infer<S>, units: Units) => string | null;
};

export const defineKind = <S extends z.ZodType<ItemLike>>(def: KindDef<S>): KindDef<S> => def;

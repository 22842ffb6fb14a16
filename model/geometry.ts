// Plan geometry shared by the document, the canvas and the meter.
// Frame: metres on the floor plan, x to the right, y down the screen (as in SVG), heights (z) up from the floor.
// Plan angles in degrees: 0° along +x, increasing towards +y (clockwise on screen, as SVG rotate()).
import { z } from 'zod';
import { oneLine } from './text';

export const metres = (max = 200) => z.number().finite().min(-max).max(max);
export const positiveMetres = (max = 50) => z.number().finite().positive().max(max);
export const degrees = z.number().finite().min(-720).max(720);

export const pointSchema = z.object({ x: metres(), y: metres() }).strict();
export type Point = z.infer<typeof pointSchema>;

/** #rrggbb */
export const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/, 'a colour as #rrggbb');

export const idSchema = z.string().min(1).max(64).regex(/^[A-Za-z0-9_-]+$/, 'letters, digits, - and _ only');

/** Fields every plan item has. */
export const itemBase = {
  id: idSchema,
  label: oneLine({ max: 80 }).default(''),
  locked: z.boolean().default(false),
};

export function normaliseDeg(deg: number): number {
  const d = deg % 360;
  return d < 0 ? d + 360 : d;
}

export function distance(a: Point, b: Point): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Unit vector in the plan for a plan angle. */
export function direction(deg: number): Point {
  const r = (deg * Math.PI) / 180;
  return { x: Math.cos(r), y: Math.sin(r) };
}

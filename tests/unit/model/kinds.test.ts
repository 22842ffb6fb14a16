// One kind, one module: every kind's definition is complete and self-consistent, its inspector fields
// read and write the fields they name, and the steppers go the way the trade expects.
import { describe, expect, it } from 'vitest';
import { sketches } from '../../../drawing/glyphs';
import { graphiteTheme } from '../../../drawing/theme';
import { itemSchema, parseDocument, type Item } from '../../../model/document';
import { sceneFromDocument } from '../../../model/documentToScene';
import { checkNumber, fieldLabel, rangeOf, type FieldContext, type FieldSpec } from '../../../model/fields';
import { roleToMeter } from '../../../model/items/light';
import { panelEnds } from '../../../model/items/shaper';
import { angleOf, createItem, fieldsOf, kindOrder, kinds, withAngle } from '../../../model/kinds';

const ctx: FieldContext = { stage: { widthM: 8, depthM: 6 } };
const flat = (fields: readonly FieldSpec<Item>[]): FieldSpec<Item>[] => fields.flatMap((f) => (f.type === 'section' ? flat(f.fields) : [f]));
const apply = (item: Item, patch: Record<string, unknown>) => itemSchema.parse({ ...item, ...patch });
const numberField = (item: Item, label: string) => {
  const f = flat(fieldsOf(item)).find((x) => x.type === 'number' && (typeof x.label === 'string' ? x.label : x.label('metric')) === label);
  if (!f || f.type !== 'number') throw new Error(`no number field "${label}" on ${item.kind}`);
  return f;
};

describe('kinds', () => {
  it("a light's settings open with what is changed most: power, modifier, grid and gel, then its label, position, aim and height", () => {
    const labels = fieldsOf(createItem('light', 'l', { x: 1, y: 1 })).map((f) => fieldLabel(f, 'metric'));
    expect(labels.slice(0, 5)).toEqual(['Power', 'Modifier', 'Fabric grid', 'Gel', 'Label']);
    const at = (l: string) => labels.findIndex((x) => x.startsWith(l));
    expect(at('Across')).toBeGreaterThan(at('Gel'));
    expect(at('Height')).toBeGreaterThan(at('Across'));
    expect(at('Aim (°)')).toBeGreaterThan(at('Gel'));
    // Every field once: moving them changed the order, not the set.
    expect(new Set(labels).size).toBe(labels.length);
    // A kind without fields of its own to put first keeps its label first.
    expect(fieldLabel(fieldsOf(createItem('subject', 's', { x: 1, y: 1 }))[0]!, 'metric')).toBe('Label');
  });

  it.each(kindOrder)('%s: a new one parses, has its sketch, and its kind names itself', (kind) => {
    const item = createItem(kind, 'n1', { x: 2, y: 3 });
    expect(item.kind).toBe(kind);
    expect(kinds[kind].kind).toBe(kind);
    expect(typeof sketches[kind]).toBe('function');
    expect(sketches[kind](item as never, { theme: graphiteTheme, units: 'metric', selected: false } as never)).toBeTruthy();
  });

  it.each(kindOrder)('%s: every inspector field writes back what it reads (set(get) leaves the item as it was)', (kind) => {
    let item: Item = createItem(kind, 'n1', { x: 2, y: 3 });
    // Show the fields that appear only with a meter reading.
    if (item.kind === 'light') item = apply(item, { calibration: { aperture: 8, distanceM: 1.5, iso: 100 } });
    for (const f of flat(fieldsOf(item))) {
      if (f.when && !f.when(item)) continue;
      const patch = f.type === 'number' ? f.set(f.get(item), item) : f.type === 'choice' ? f.set(f.get(item), item) : f.type === 'switch' ? f.set(f.get(item), item) : f.type === 'text' ? f.set(f.get(item), item) : {};
      expect(apply(item, patch), `${kind}: ${f.type} ${String(f.label)}`).toEqual(item);
    }
  });

  // (A wall's colour swatches are suggestions beside a typed #rrggbb, so a new wall's colour need not be one.)
  it.each(kindOrder)('%s: every choice field offers the value it shows', (kind) => {
    const item = createItem(kind, 'n1', { x: 2, y: 3 });
    for (const f of flat(fieldsOf(item))) if (f.type === 'choice' && f.label !== 'Colour' && (!f.when || f.when(item))) expect(f.options.map((o) => o.id)).toContain(f.get(item));
  });

  it('turns items along the field their kind names, and leaves segments alone', () => {
    const light = createItem('light', 'l', { x: 0, y: 0 });
    expect(angleOf(withAngle(light, 33))).toBe(33);
    expect((withAngle(light, 33) as { aimDeg: number }).aimDeg).toBe(33);
    expect((withAngle(createItem('subject', 's', { x: 0, y: 0 }), 12) as { facingDeg: number }).facingDeg).toBe(12);
    expect((withAngle(createItem('flag', 'f', { x: 0, y: 0 }), 45) as { rotationDeg: number }).rotationDeg).toBe(45);
    expect(angleOf(createItem('wall', 'w', { x: 0, y: 0 }))).toBeNull();
  });
});

describe('a panel\'s angle field names the way its face points', () => {
  it('is "Facing (°)" on every panel, and the panel stands square to that direction', () => {
    // A flag typed to face a beam aimed at −45° (facing 135°) must stand across that beam, not along it.
    for (const kind of ['reflector', 'flag', 'vflat', 'scrim'] as const) {
      const labels = fieldsOf(createItem(kind, 'p', { x: 1, y: 1 })).map((f) => f.label);
      expect(labels, kind).toContain('Facing (°)');
      expect(labels, kind).not.toContain('Turn (°)');
    }
    const { a, b } = panelEnds({ x: 0, y: 0, rotationDeg: 135, widthM: 1 });
    const along = { x: b.x - a.x, y: b.y - a.y };
    const facing = { x: Math.cos((135 * Math.PI) / 180), y: Math.sin((135 * Math.PI) / 180) };
    expect(along.x * facing.x + along.y * facing.y).toBeCloseTo(0, 9);
  });
});

describe('steppers go the way the trade expects', () => {
  const camera = createItem('camera', 'c', { x: 0, y: 0 }); // f/8, 1/200 s, ISO 100 by default
  const step = (label: string, dir: -1 | 1, item: Item = camera) => apply(item, numberField(item, label).step!(item, dir, ctx));

  // The third-stop scales (ISO 100 125 160 200…, f/5.6 6.3 7.1 8…, 1/250 1/200 1/160…) are common practice.
  it('ISO: "+" raises the ISO to the next third-stop value, "−" lowers it', () => {
    expect((step('ISO', 1) as typeof camera).iso).toBe(125);
    expect((step('ISO', -1) as typeof camera).iso).toBe(80);
  });

  it('walks the whole third-stop ISO, aperture and shutter scales one step at a time', () => {
    const walk = (label: string, key: 'iso' | 'aperture' | 'shutterS', start: number, dir: -1 | 1, n: number) => {
      let c: Item = apply(camera, { [key]: start });
      const seen: number[] = [];
      for (let k = 0; k < n; k++) {
        c = step(label, dir, c);
        seen.push((c as unknown as Record<string, number>)[key]!);
      }
      return seen;
    };
    expect(walk('ISO', 'iso', 100, 1, 7)).toEqual([125, 160, 200, 250, 320, 400, 500]);
    expect(walk('Aperture (f/)', 'aperture', 1.4, 1, 8)).toEqual([1.6, 1.8, 2, 2.2, 2.5, 2.8, 3.2, 3.5]);
    expect(walk('Shutter (s)', 'shutterS', 1 / 250, -1, 3).map((t) => Math.round(1 / t))).toEqual([200, 160, 125]);
  });

  it('shutter: "+" gives the next faster (shorter) speed, "−" the next slower', () => {
    expect((step('Shutter (s)', 1) as typeof camera).shutterS).toBeCloseTo(1 / 250, 9);
    expect((step('Shutter (s)', -1) as typeof camera).shutterS).toBeCloseTo(1 / 160, 9);
  });

  it('aperture: "+" closes down to the next f-number on the third-stop scale', () => {
    expect((step('Aperture (f/)', 1) as typeof camera).aperture).toBe(9);
    expect((step('Aperture (f/)', -1) as typeof camera).aperture).toBe(7.1);
  });

  it('power: "+" is a third of a stop more, within 1/256 and full', () => {
    const light = createItem('light', 'l', { x: 0, y: 0 }); // 1/4
    expect((step('Power', 1, light) as { power: number }).power).toBeCloseTo(0.25 * 2 ** (1 / 3), 9);
    const full = apply(light, { power: 1 });
    expect((step('Power', 1, full) as { power: number }).power).toBe(1);
  });
});

describe('number fields say what they accept', () => {
  const fieldsWithNumbers = (kind: (typeof kindOrder)[number]) => {
    let item: Item = createItem(kind, 'n1', { x: 2, y: 3 });
    if (item.kind === 'light') item = apply(item, { calibration: { aperture: 8, distanceM: 1.5, iso: 100 } });
    return { item, fields: flat(fieldsOf(item)).filter((f) => f.type === 'number' && (!f.when || f.when(item))) };
  };

  it.each(kindOrder)('%s: both ends of every number field\'s range are values the document accepts', (kind) => {
    const { item, fields } = fieldsWithNumbers(kind);
    for (const f of fields) {
      if (f.type !== 'number') continue;
      const r = rangeOf(f, ctx);
      for (const v of [r.min, r.max]) expect(itemSchema.safeParse({ ...item, ...f.set(v, item) }).success, `${kind} ${String(f.label)} = ${v}`).toBe(true);
    }
  });

  it('refuses a value outside the range with a message naming the range, in the field\'s own notation', () => {
    const camera = createItem('camera', 'c', { x: 1, y: 1 });
    const iso = numberField(camera, 'ISO');
    expect(checkNumber(iso, '0', 'metric', ctx)).toEqual({ ok: false, message: 'Out of range. Accepted: 25 to 409600.' });
    expect(checkNumber(iso, '1e8', 'metric', ctx)).toMatchObject({ ok: false, message: expect.stringContaining('Accepted: 25 to 409600.') });
    expect(checkNumber(numberField(camera, 'Shutter (s)'), '0', 'metric', ctx)).toMatchObject({ ok: false, message: expect.stringContaining('1/8000 to 30″') });
    expect(checkNumber(iso, '400', 'metric', ctx)).toEqual({ ok: true, value: 400 });
  });

  it('keeps positions on the stage: the range is the stage, in the user\'s units', () => {
    const light = createItem('light', 'l', { x: 1, y: 1 });
    const across = numberField(light, 'Across (m)');
    expect(checkNumber(across, '-1', 'metric', ctx)).toEqual({ ok: false, message: 'Out of range. Accepted: 0.00 to 8.00.' });
    expect(checkNumber(across, '9', 'metric', { stage: { widthM: 10, depthM: 6 } })).toEqual({ ok: true, value: 9 });
    expect(checkNumber(across, '30', 'imperial', ctx)).toMatchObject({ ok: false, message: 'Out of range. Accepted: 0′ 0″ to 26′ 3″.' });
    // The steppers stop at the stage's edge.
    expect((apply(light, across.step!(apply(light, { x: 7.95 }), 1, ctx)) as { x: number }).x).toBe(8);
  });
});

describe('a light\'s role reaches the meter', () => {
  // Rims, hair lights and kickers each reach the meter as themselves (it reads them pointed at the light,
  // against the key); a hair light must never be metered as a fill.
  it.each([
    ['key', 'key'],
    ['fill', 'fill'],
    ['rim', 'rim'],
    ['hair', 'hair'],
    ['kicker', 'kicker'],
    ['background', 'background'],
    ['accent', 'other'],
  ] as const)('%s is metered as %s', (role, meterRole) => {
    expect(roleToMeter[role]).toBe(meterRole);
    const d = parseDocument({
      schemaVersion: 1,
      stage: { widthM: 8, depthM: 6 },
      items: [
        { id: 's', kind: 'subject', x: 4, y: 3 },
        { id: 'l', kind: 'light', x: 4, y: 1, source: { type: 'strobe', energyWs: 500 }, role },
      ],
    });
    expect(sceneFromDocument(d).scene!.lights[0]!.role).toBe(meterRole);
  });
});

// People see items by their names, never by internal ids: on the crew sheet and in the meter's warnings.
import { describe, expect, it } from 'vitest';
import { crewSheet } from '../../../model/crewSheet';
import { parseDocument } from '../../../model/document';
import { itemNames, warningText } from '../../../model/kinds';

const doc = parseDocument({
  schemaVersion: 2,
  stage: { widthM: 8, depthM: 6 },
  items: [
    { id: 'subject-1', kind: 'subject', x: 4, y: 3 },
    { id: 'camera-1', kind: 'camera', x: 4, y: 5.5, aimDeg: -90 },
    { id: 'light-1', kind: 'light', x: 2.5, y: 2.5, source: { type: 'strobe', energyWs: 500 }, label: 'Key' },
    { id: 'light-2', kind: 'light', x: 5.5, y: 2.5, source: { type: 'strobe', energyWs: 500 } },
    { id: 'light-3', kind: 'light', x: 5.5, y: 1, source: { type: 'strobe', energyWs: 500 } },
  ],
  steps: [{ id: 's1', title: 'Camera first', itemIds: ['camera-1'] }],
});

describe('item names', () => {
  it('uses the label, else the kind (numbered when there are several unlabelled)', () => {
    const names = itemNames(doc.items);
    expect([...names.values()]).toEqual(['Subject', 'Camera', 'Key', 'Light 1', 'Light 2']);
  });

  it('puts the light\'s name where a warning had its id', () => {
    expect(warningText({ message: 'light-1 would need less than its lowest power for f/2', lightId: 'light-1' }, itemNames(doc.items))).toBe('Key would need less than its lowest power for f/2');
  });

  it('the crew sheet says "Adds: Camera", never an id', () => {
    const sheet = crewSheet(doc, { title: 'Names', units: 'metric' });
    expect(sheet.steps[0]!.adds).toEqual(['Camera']);
    // Each light keeps its id as data (the exports link it); nothing printed carries one.
    expect(JSON.stringify(sheet, (k, v) => (k === 'id' ? undefined : v))).not.toMatch(/(camera|light|subject)-\d/);
  });
});

describe('item names, many items', () => {
  it('numbers hundreds of unlabelled items in order, once per items array', () => {
    const items = parseDocument({
      schemaVersion: 2,
      stage: { widthM: 8, depthM: 6 },
      items: Array.from({ length: 400 }, (_, k) => ({ id: `l${k}`, kind: 'light', x: 1 + (k % 20) * 0.3, y: 1 + Math.floor(k / 20) * 0.2, source: { type: 'strobe', energyWs: 500 } })),
    }).items;
    const names = itemNames(items);
    expect(names.get('l0')).toBe('Light 1');
    expect(names.get('l399')).toBe('Light 400');
    // The same array asks again: the same answer, not worked out anew.
    expect(itemNames(items)).toBe(names);
    expect(itemNames([...items])).not.toBe(names);
  });
});

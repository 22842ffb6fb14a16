// Direct manipulation, headless: new items in a free spot near the view's middle, a new camera aimed at the
// subject, the aim and height handles as a tool (down / move / up), the view re-fitted above the phone's
// sheet, and heights kept under the ceiling.
import { describe, expect, it } from 'vitest';
import { run } from '../../../canvas/editor/actions';
import { fitStage, toScreen } from '../../../canvas/editor/camera';
import { createEditor, type Editor } from '../../../canvas/editor/editor';
import { maxHeight } from '../../../canvas/editor/heights';
import { isFitted } from '../../../canvas/editor/inset';
import { FREE_RADIUS_M, freeSpot, initialAim } from '../../../canvas/editor/placement';
import { initialState } from '../../../canvas/editor/state';
import { AIM_HANDLE_PX, HEIGHT_PX_PER_M, handlesOf } from '../../../canvas/editor/tools/handles';
import { demoSetups } from '../../../db/seed-setups';
import { parseDocument, type SetupDocument } from '../../../model/document';

const empty = (): SetupDocument => parseDocument({ schemaVersion: demoSetups[0]!.document.schemaVersion, stage: { widthM: 8, depthM: 6 }, items: [], steps: [], shots: [] });
const at = (e: Editor, id: string) => e.getState().doc.items.find((i) => i.id === id) as any;

function phoneEditor(doc = empty()) {
  const e = createEditor(doc);
  e.dispatch('setViewport', { w: 390, h: 700, insetBottom: 132 });
  return e;
}

describe('new items', () => {
  it('land in a free spot near the middle of the view, never on top of each other', () => {
    const e = phoneEditor();
    for (let k = 0; k < 6; k++) e.dispatch('placeItem', { kind: 'light' });
    const lights = e.getState().doc.items as { x: number; y: number }[];
    expect(lights).toHaveLength(6);
    for (let a = 0; a < lights.length; a++)
      for (let b = a + 1; b < lights.length; b++) expect(Math.hypot(lights[a]!.x - lights[b]!.x, lights[a]!.y - lights[b]!.y)).toBeGreaterThanOrEqual(FREE_RADIUS_M - 0.25 - 0.05);
    // All of them near the middle (within 2 m of the stage's centre, which is what the fitted view shows).
    for (const l of lights) expect(Math.hypot(l.x - 4, l.y - 3)).toBeLessThan(2);
  });

  it('the first lands in the middle of the part of the plan above the sheet', () => {
    const e = phoneEditor();
    e.dispatch('placeItem', { kind: 'subject' });
    expect(at(e, 'subject-1')).toMatchObject({ x: 4, y: 3 });
  });

  it('stay on the stage when the view looks at its corner', () => {
    const spot = freeSpot([], { widthM: 8, depthM: 6 }, { x: -5, y: 20 });
    expect(spot.x).toBeGreaterThanOrEqual(0.3);
    expect(spot.y).toBeLessThanOrEqual(5.7);
  });

  it('a new camera (and a new light) is aimed at the subject', () => {
    const e = phoneEditor();
    e.dispatch('placeItem', { kind: 'subject' });
    e.dispatch('placeItem', { kind: 'camera' });
    const cam = at(e, 'camera-1');
    const subj = at(e, 'subject-1');
    const toward = (Math.atan2(subj.y - cam.y, subj.x - cam.x) * 180) / Math.PI;
    expect(Math.abs(cam.aimDeg - toward)).toBeLessThanOrEqual(0.6);
    e.dispatch('placeItem', { kind: 'light' });
    const l = at(e, 'light-1');
    expect(Math.abs(l.aimDeg - (Math.atan2(subj.y - l.y, subj.x - l.x) * 180) / Math.PI)).toBeLessThanOrEqual(0.6);
    expect(initialAim('wall', { x: 0, y: 0 }, e.getState().doc.items)).toBeNull();
  });

  it('a new camera stands in front of the subject at a working distance and at its face height', () => {
    // Look 1: a seated subject (face 1.2 m) in the middle of an 8 × 6 m stage, facing down the plan. The camera
    // used to land 0.7 m beside the subject at 1.5 m, so the face sat at the bottom of the frame.
    const e = phoneEditor();
    e.dispatch('placeItem', { kind: 'subject' });
    e.dispatch('updateItem', { id: 'subject-1', patch: { facingDeg: 90, pose: 'seated', faceHeightM: 1.2 } });
    e.dispatch('placeItem', { kind: 'camera' });
    const cam = at(e, 'camera-1');
    const subj = at(e, 'subject-1');
    expect(Math.hypot(cam.x - subj.x, cam.y - subj.y)).toBeGreaterThanOrEqual(2);
    expect(cam.x).toBeCloseTo(subj.x, 9); // along the facing
    expect(cam.y).toBeGreaterThan(subj.y);
    expect(cam.y).toBeLessThanOrEqual(6 - 0.3);
    expect(cam.heightM).toBe(1.2);
    expect(Math.abs(cam.aimDeg - -90)).toBeLessThanOrEqual(0.6);
  });

  it('a new camera falls back to a free spot when the subject faces the stage edge', () => {
    const e = phoneEditor();
    e.dispatch('placeItem', { kind: 'subject' });
    e.dispatch('updateItem', { id: 'subject-1', patch: { x: 4, y: 0.6, facingDeg: -90 } });
    e.dispatch('placeItem', { kind: 'camera' });
    const cam = at(e, 'camera-1');
    expect(cam.y).toBeGreaterThanOrEqual(0.3);
  });

  it('one undo takes a placed item away', () => {
    const e = phoneEditor();
    e.dispatch('placeItem', { kind: 'camera' });
    e.dispatch('undo');
    expect(e.getState().doc.items).toHaveLength(0);
  });
});

describe('the aim and height handles', () => {
  function withKey() {
    const e = createEditor(demoSetups[0]!.document);
    e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
    e.dispatch('setInput', { boxSelect: false });
    e.dispatch('select', { ids: ['key'] });
    return e;
  }

  it('sit at fixed screen distances from the selected light, whatever the zoom', () => {
    const e = withKey();
    const h = handlesOf(e.getState(), 'key')!;
    // The key at (4, 4.1) aims −90° (up the screen): the aim handle above, the height handle below.
    expect(h.aim).toEqual({ x: 400, y: expect.closeTo(410 - AIM_HANDLE_PX, 6) });
    expect(h.height.y).toBeGreaterThan(410);
    e.dispatch('setCamera', { camera: { scale: 30, tx: 0, ty: 0 } });
    const z = handlesOf(e.getState(), 'key')!;
    expect(Math.hypot(z.aim.x - z.centre.x, z.aim.y - z.centre.y)).toBeCloseTo(AIM_HANDLE_PX, 6);
  });

  it('dragging the aim handle turns the light, as one undo step', () => {
    const e = withKey();
    const h = handlesOf(e.getState(), 'key')!;
    e.pointer.down({ screen: h.aim, pointer: 'touch' });
    expect(e.activeTool().id).toBe('handles');
    expect(e.activeTool().state.name).toBe('aiming');
    for (let k = 1; k <= 8; k++) e.pointer.move({ screen: { x: 400 + k * 10, y: 410 }, pointer: 'touch' });
    expect(e.getState().gesture).toMatch(/^aim-/);
    e.pointer.up({ screen: { x: 480, y: 410 }, pointer: 'touch' });
    expect(at(e, 'key').aimDeg).toBe(0);
    expect(at(e, 'key').x).toBe(4); // turned, not moved
    expect(e.getState().gesture).toBeNull();
    e.dispatch('undo');
    expect(at(e, 'key').aimDeg).toBe(-90);
  });

  it('dragging the height handle up raises the light by HEIGHT_PX_PER_M pixels to the metre, under the ceiling', () => {
    const e = withKey();
    const h = handlesOf(e.getState(), 'key')!;
    e.pointer.down({ screen: h.height, pointer: 'touch' });
    expect(e.activeTool().state.name).toBe('lifting');
    e.pointer.move({ screen: { x: h.height.x, y: h.height.y - HEIGHT_PX_PER_M * 0.4 }, pointer: 'touch' });
    e.pointer.up({ screen: h.height, pointer: 'touch' });
    expect(at(e, 'key').heightM).toBeCloseTo(2.5, 6);
    expect(e.getState().past).toHaveLength(1);
    // Far up: stops under the ceiling (3 m by default).
    const h2 = handlesOf(e.getState(), 'key')!;
    e.pointer.down({ screen: h2.height, pointer: 'touch' });
    e.pointer.move({ screen: { x: h2.height.x, y: h2.height.y - 1000 }, pointer: 'touch' });
    e.pointer.up({ screen: h2.height, pointer: 'touch' });
    expect(at(e, 'key').heightM).toBeCloseTo(maxHeight(e.getState().doc), 6);
    expect(maxHeight(e.getState().doc)).toBeCloseTo(2.9, 6);
  });

  it('a press on the light itself still moves it; an unselected or locked light has no handles', () => {
    const e = withKey();
    e.pointer.down({ screen: { x: 400, y: 410 }, pointer: 'touch' });
    expect(e.activeTool().state.name).toBe('dragging');
    e.pointer.up({ screen: { x: 400, y: 410 }, pointer: 'touch' });
    e.dispatch('select', { ids: ['sitter'] });
    expect(handlesOf(e.getState(), 'sitter')).toBeNull();
    e.dispatch('select', { ids: ['key'] });
    e.dispatch('toggleLock');
    expect(handlesOf(e.getState(), 'key')).toBeNull();
  });

  it('a read-only plan shows no handles', () => {
    const e = createEditor(demoSetups[0]!.document, { readOnly: true });
    e.dispatch('setCamera', { camera: { scale: 100, tx: 0, ty: 0 } });
    e.dispatch('select', { ids: ['key'] });
    expect(handlesOf(e.getState(), 'key')).toBeNull();
  });
});

describe('the view above the sheet', () => {
  it('a fitted plan is fitted again to the space left as the sheet rises', () => {
    let s = run(initialState(demoSetups[0]!.document), 'setViewport', { w: 390, h: 700, insetBottom: 132 });
    expect(isFitted(s.camera!, s.doc.stage, s.viewport)).toBe(true);
    s = run(s, 'setViewport', { w: 390, h: 700, insetBottom: 380 });
    expect(s.camera).toEqual(fitStage(s.doc.stage, 390, 320));
    // The whole stage is above the sheet.
    const bottom = toScreen(s.camera!, { x: 8, y: 6 });
    expect(bottom.y).toBeLessThanOrEqual(320);
  });

  it('a zoomed-in plan keeps its zoom and brings the selected item above the sheet', () => {
    let s = run(initialState(demoSetups[0]!.document), 'setViewport', { w: 390, h: 700, insetBottom: 132 });
    s = run(s, 'setCamera', { camera: { scale: 120, tx: -300, ty: -150 } });
    s = run(s, 'select', { ids: ['cam'] }); // at (4, 5.4): y = 498 px, visible above a 132 px sheet
    s = run(s, 'setViewport', { w: 390, h: 700, insetBottom: 420 });
    expect(s.camera!.scale).toBe(120);
    const p = toScreen(s.camera!, { x: 4, y: 5.4 });
    expect(p.y).toBeLessThanOrEqual(280);
    expect(p.y).toBeGreaterThan(0);
  });
});

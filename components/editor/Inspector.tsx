// The item inspector: the selected item's properties with units, changed through editor actions.
import { memo, useCallback, useDeferredValue } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { actions } from '../../canvas/state/actions';
import { useEditor, useEditorStore } from '../../canvas/state/store';
import { colours, fonts, space } from '../../constants/theme';
import type { Item, ItemOf } from '../../model/document';
import { sensorFormats, type SensorFormat } from '../../model/items/camera';
import { lightRoles } from '../../model/items/light';
import { propShapes } from '../../model/items/prop';
import { angleOf, kinds } from '../../model/kinds';
import { gelChoices, modifierChoices } from '../../model/scene';
import { formatAperture, formatPower, formatShutter, parseFraction, parseLength, parseNumber, toDisplay, unitSuffix, type Units } from '../../model/units';
import { Body } from '../ui';
import { ChoiceField, NumberField, SwitchField, TextField } from './fields';

const num = parseNumber;
const fixed = (d: number) => (v: number) => v.toFixed(d);
const third = 2 ** (1 / 3);

type Patch = Record<string, unknown> | ((item: Item) => Record<string, unknown>);

function useUpdate(id: string) {
  const store = useEditorStore();
  return useCallback((patch: Patch) => store.dispatch('updateItem', { id, patch }), [store, id]);
}

export const Inspector = memo(function Inspector({ units }: { units: Units }) {
  const selection = useEditor((s) => s.selection);
  const current = useEditor((s) => (s.selection.length === 1 ? s.doc.items.find((i) => i.id === s.selection[0]) : undefined));
  // The form is a large render; it follows the plan at low priority so a press or a drag frame never waits
  // for it (React renders the deferred value in the background and can interrupt it).
  const item = useDeferredValue(current);
  const readOnly = useEditor((s) => s.readOnly);
  if (!item) {
    return (
      <View style={s.wrap}>
        <Body dim>{selection.length > 1 ? `${selection.length} items selected. Drag any of them to move them together.` : 'Tap an item on the plan to see and change its settings, or add one from the kit.'}</Body>
        {selection.length > 1 && !readOnly ? <SelectionActions /> : null}
      </View>
    );
  }
  return (
    <View style={s.wrap} pointerEvents={readOnly ? 'none' : 'auto'} accessibilityLabel={`Settings of ${kinds[item.kind].label}`}>
      <Text style={s.heading}>{kinds[item.kind].label}</Text>
      {!readOnly ? <SelectionActions /> : null}
      <ItemFields item={item} units={units} />
    </View>
  );
});

/** Duplicate, lock and delete as buttons too: a phone has no keyboard shortcuts. */
function SelectionActions() {
  const store = useEditorStore();
  const locked = useEditor((s) => s.doc.items.some((i) => s.selection.includes(i.id) && i.locked));
  const button = (name: 'duplicateSelection' | 'toggleLock' | 'deleteSelection', label: string) => (
    <Pressable key={name} accessibilityRole="button" accessibilityLabel={label} onPress={() => store.dispatch(name)} style={({ pressed }) => [s.action, pressed && { backgroundColor: colours.panelRaised }]}>
      <Text style={s.actionText}>{label}</Text>
    </Pressable>
  );
  return (
    <View style={s.actions}>
      {button('duplicateSelection', actions.duplicateSelection.label)}
      {button('toggleLock', locked ? 'Unlock' : 'Lock')}
      {button('deleteSelection', actions.deleteSelection.label)}
    </View>
  );
}

function ItemFields({ item, units }: { item: Item; units: Units }) {
  const update = useUpdate(item.id);
  const length = (label: string, value: number, key: string, step = 0.1, testID?: string) => (
    <NumberField
      key={key}
      label={`${label} (${unitSuffix(units)})`}
      value={value}
      format={(v) => toDisplay(v, units).toFixed(2)}
      parse={(t) => parseLength(t, units)}
      onCommit={(v) => update({ [key]: v })}
      onStep={(d) => update({ [key]: Math.round((value + d * step) * 1000) / 1000 })}
      testID={testID}
    />
  );
  const angle = angleOf(item);
  const angleKey = item.kind === 'subject' ? 'facingDeg' : item.kind === 'light' || item.kind === 'camera' ? 'aimDeg' : 'rotationDeg';
  return (
    <>
      <TextField label="Label" value={item.label} onCommit={(v) => update({ label: v })} />
      {'x' in item ? length('Across', item.x, 'x', 0.1, 'field-x') : null}
      {'y' in item ? length('Down', item.y, 'y', 0.1, 'field-y') : null}
      {angle !== null ? (
        <NumberField label={item.kind === 'subject' ? 'Facing (°)' : item.kind === 'light' || item.kind === 'camera' ? 'Aim (°)' : 'Turn (°)'} value={angle} format={fixed(0)} parse={num} onCommit={(v) => update({ [angleKey]: v })} onStep={(d) => update({ [angleKey]: angle + d * 5 })} />
      ) : null}
      <KindFields item={item} units={units} update={update} length={length} />
      <SwitchField label="Locked" value={item.locked} onChange={(v) => update({ locked: v })} />
    </>
  );
}

type KindProps = { item: Item; units: Units; update: (p: Patch) => void; length: (label: string, value: number, key: string, step?: number) => React.ReactElement };

function KindFields({ item, update, length }: KindProps) {
  switch (item.kind) {
    case 'light':
      return <LightFields light={item} update={update} length={length} />;
    case 'camera':
      return <CameraFields camera={item} update={update} length={length} />;
    case 'subject':
      return (
        <>
          {length('Face height', item.faceHeightM, 'faceHeightM', 0.05)}
          <ChoiceField label="Pose" value={item.pose} options={[{ id: 'standing', label: 'standing' }, { id: 'seated', label: 'seated' }]} onChange={(v) => update({ pose: v, faceHeightM: v === 'seated' ? 1.2 : 1.6 })} />
        </>
      );
    case 'wall':
      return (
        <>
          <ChoiceField label="Surface" value={item.surface} options={[{ id: 'wall', label: 'painted wall' }, { id: 'seamless', label: 'seamless paper' }, { id: 'curtain', label: 'curtain' }]} onChange={(v) => update({ surface: v })} />
          {length('Height', item.heightM, 'heightM', 0.1)}
          <ChoiceField label="Colour" value={item.colour.toLowerCase()} options={wallColours} onChange={(v) => update({ colour: v })} />
          <TextField label="Colour (#rrggbb)" value={item.colour} onCommit={(v) => update({ colour: v.trim() })} />
          <NumberField
            label="Reflectance (%, blank = from colour)"
            value={item.reflectance === null ? -1 : item.reflectance * 100}
            format={(v) => (v < 0 ? '' : v.toFixed(0))}
            parse={(t) => (t.trim() === '' ? -1 : num(t))}
            onCommit={(v) => update({ reflectance: v < 0 ? null : v / 100 })}
          />
        </>
      );
    case 'reflector':
    case 'flag':
    case 'vflat':
    case 'scrim':
      return (
        <>
          {item.kind === 'reflector' ? <ChoiceField label="Finish" value={item.finish} options={[{ id: 'white', label: 'white' }, { id: 'silver', label: 'silver' }, { id: 'gold', label: 'gold' }]} onChange={(v) => update({ finish: v })} /> : null}
          {item.kind === 'vflat' ? <ChoiceField label="Face towards the set" value={item.face} options={[{ id: 'white', label: 'white (bounce)' }, { id: 'black', label: 'black (negative fill)' }]} onChange={(v) => update({ face: v })} /> : null}
          {item.kind === 'scrim' ? <NumberField label="Loss (stops)" value={item.lossStops} format={fixed(1)} parse={num} onCommit={(v) => update({ lossStops: v })} onStep={(d) => update({ lossStops: Math.max(0, item.lossStops + d * 0.5) })} /> : null}
          {length('Width', item.widthM, 'widthM', 0.1)}
          {length('Height', item.heightM, 'heightM', 0.1)}
          {length('Lower edge', item.baseM, 'baseM', 0.1)}
        </>
      );
    case 'prop':
      return <ChoiceField label="Shape" value={item.shape} options={propShapes.map((p) => ({ id: p, label: p.replace('-', ' ') }))} onChange={(v) => update({ shape: v })} />;
    case 'note':
      return <TextField label="Text" value={item.text} onCommit={(v) => update({ text: v })} multiline />;
    default:
      return null;
  }
}

const wallColours = [
  { id: '#f2f0ea', label: 'white', swatch: '#f2f0ea' },
  { id: '#8a8d90', label: 'mid grey', swatch: '#8a8d90' },
  { id: '#151515', label: 'black', swatch: '#151515' },
  { id: '#c9c2b4', label: 'warm stone', swatch: '#c9c2b4' },
  { id: '#2f5d50', label: 'deep green', swatch: '#2f5d50' },
  { id: '#b5533c', label: 'brick red', swatch: '#b5533c' },
];

function LightFields({ light, update, length }: { light: ItemOf<'light'>; update: KindProps['update']; length: KindProps['length'] }) {
  const src = light.source;
  const setSource = (patch: Record<string, unknown>) => update((i) => ({ source: { ...(i as ItemOf<'light'>).source, ...patch } }));
  return (
    <>
      <SwitchField label="On" value={light.on} onChange={(v) => update({ on: v })} />
      <NumberField
        label="Power"
        value={light.power}
        format={formatPower}
        parse={parseFraction}
        onCommit={(v) => update({ power: v })}
        onStep={(d) => update({ power: Math.min(1, Math.max(1 / 256, light.power * third ** d)) })}
        testID="field-power"
      />
      {length('Height', light.heightM, 'heightM', 0.1)}
      <NumberField label="Tilt (°, down is −)" value={light.tiltDeg} format={fixed(0)} parse={num} onCommit={(v) => update({ tiltDeg: v })} onStep={(d) => update({ tiltDeg: light.tiltDeg + d * 5 })} />
      <ChoiceField
        label="Source"
        value={src.type}
        options={[{ id: 'strobe', label: 'strobe head' }, { id: 'speedlight', label: 'speedlight' }, { id: 'continuous', label: 'continuous' }]}
        onChange={(t) =>
          update({
            source: t === 'strobe' ? { type: 'strobe', energyWs: 500 } : t === 'speedlight' ? { type: 'speedlight', guideNumberM: 45 } : { type: 'continuous', lamp: 'led', lumens: 8000, luxAt1m: null, watts: 100, kelvin: 5600 },
          })
        }
      />
      {src.type === 'strobe' ? <NumberField label="Rated energy (Ws)" value={src.energyWs} format={fixed(0)} parse={num} onCommit={(v) => setSource({ energyWs: v })} /> : null}
      {src.type === 'speedlight' ? <NumberField label="Guide number (m, ISO 100)" value={src.guideNumberM} format={fixed(0)} parse={num} onCommit={(v) => setSource({ guideNumberM: v })} /> : null}
      {src.type === 'continuous' ? (
        <>
          <ChoiceField label="Lamp" value={src.lamp} options={[{ id: 'led', label: 'LED' }, { id: 'tungsten', label: 'tungsten' }]} onChange={(v) => setSource({ lamp: v, kelvin: v === 'tungsten' ? 3200 : 5600 })} />
          <NumberField label="Output (lumens)" value={src.lumens ?? 0} format={fixed(0)} parse={num} onCommit={(v) => setSource({ lumens: v, luxAt1m: null })} />
          <NumberField label="Draw (W)" value={src.watts} format={fixed(0)} parse={num} onCommit={(v) => setSource({ watts: v })} />
          <NumberField label="Colour temperature (K)" value={src.kelvin} format={fixed(0)} parse={num} onCommit={(v) => setSource({ kelvin: v })} />
        </>
      ) : null}
      <ChoiceField label="Modifier" value={light.modifier} options={modifierChoices} onChange={(v) => update({ modifier: v })} />
      <ChoiceField label="Fabric grid" value={light.gridDeg === null ? 'none' : String(light.gridDeg)} options={[{ id: 'none', label: 'none' }, ...['10', '20', '30', '40'].map((g) => ({ id: g, label: `${g}°` }))]} onChange={(v) => update({ gridDeg: v === 'none' ? null : Number(v) })} />
      <ChoiceField label="Gel" value={light.gel} options={gelChoices.map((g) => ({ id: g.id, label: g.label, swatch: g.tint }))} onChange={(v) => update({ gel: v })} />
      <ChoiceField label="Role" value={light.role} options={lightRoles.map((r) => ({ id: r, label: r }))} onChange={(v) => update({ role: v })} />
      <ChoiceField label="Stand" value={light.stand} options={[{ id: 'stand', label: 'stand' }, { id: 'boom', label: 'boom' }, { id: 'floor', label: 'floor' }, { id: 'handheld', label: 'handheld' }]} onChange={(v) => update({ stand: v })} />
      <SwitchField label="Sandbagged" value={light.sandbagged} onChange={(v) => update({ sandbagged: v })} />
      <Calibration light={light} update={update} />
    </>
  );
}

/** One real meter reading anchors this light's predictions from then on. */
function Calibration({ light, update }: { light: ItemOf<'light'>; update: KindProps['update'] }) {
  const c = light.calibration;
  const setCal = (patch: Record<string, unknown>) => update((i) => ({ calibration: { ...(i as ItemOf<'light'>).calibration, ...patch } }));
  return (
    <View style={s.box}>
      <Text style={s.sub}>Meter reading</Text>
      <SwitchField label="Use a real reading" value={c !== null} onChange={(v) => update({ calibration: v ? { aperture: 8, distanceM: 1.5, iso: 100, shutterS: light.source.type === 'continuous' ? 1 / 125 : null, power: light.power } : null })} />
      {c ? (
        <>
          <NumberField label="Meter showed (f/)" value={c.aperture} format={(v) => formatAperture(v).slice(2)} parse={num} onCommit={(v) => setCal({ aperture: v })} />
          <NumberField label="At distance (m)" value={c.distanceM} format={fixed(2)} parse={num} onCommit={(v) => setCal({ distanceM: v })} />
          <NumberField label="Meter ISO" value={c.iso} format={fixed(0)} parse={num} onCommit={(v) => setCal({ iso: v })} />
        </>
      ) : null}
    </View>
  );
}

const shutterSteps = [1 / 8000, 1 / 4000, 1 / 2000, 1 / 1000, 1 / 500, 1 / 320, 1 / 250, 1 / 200, 1 / 160, 1 / 125, 1 / 100, 1 / 60, 1 / 30, 1 / 15, 1 / 8, 1 / 4, 1 / 2, 1];
const apertureSteps = [1.4, 1.8, 2, 2.8, 3.5, 4, 5.6, 6.3, 7.1, 8, 9, 10, 11, 13, 16, 22];
const isoSteps = [50, 64, 100, 125, 160, 200, 400, 800, 1600, 3200, 6400];
const stepIn = (list: number[], v: number, d: number) => {
  const i = list.reduce((best, x, k) => (Math.abs(Math.log(x / v)) < Math.abs(Math.log(list[best]! / v)) ? k : best), 0);
  return list[Math.min(list.length - 1, Math.max(0, i + d))]!;
};

function CameraFields({ camera, update, length }: { camera: ItemOf<'camera'>; update: KindProps['update']; length: KindProps['length'] }) {
  return (
    <>
      <NumberField label="Aperture (f/)" value={camera.aperture} format={(v) => formatAperture(v).slice(2)} parse={num} onCommit={(v) => update({ aperture: v })} onStep={(d) => update({ aperture: stepIn(apertureSteps, camera.aperture, d) })} testID="field-aperture" />
      <NumberField
        label="Shutter (s)"
        value={camera.shutterS}
        format={formatShutter}
        parse={parseFraction}
        onCommit={(v) => update({ shutterS: v })}
        onStep={(d) => update({ shutterS: stepIn(shutterSteps, camera.shutterS, -d) })}
      />
      <NumberField label="ISO" value={camera.iso} format={fixed(0)} parse={num} onCommit={(v) => update({ iso: v })} onStep={(d) => update({ iso: stepIn(isoSteps, camera.iso, d) })} />
      <NumberField label="ND on the lens (stops)" value={camera.ndStops} format={fixed(0)} parse={num} onCommit={(v) => update({ ndStops: v })} onStep={(d) => update({ ndStops: Math.max(0, camera.ndStops + d) })} />
      <NumberField label="Focal length (mm)" value={camera.focalMm} format={fixed(0)} parse={num} onCommit={(v) => update({ focalMm: v })} />
      <ChoiceField label="Sensor" value={camera.sensor} options={(Object.keys(sensorFormats) as SensorFormat[]).map((k) => ({ id: k, label: sensorFormats[k].label }))} onChange={(v) => update({ sensor: v })} />
      <NumberField
        label="Flash sync (s)"
        value={camera.syncS}
        format={formatShutter}
        parse={parseFraction}
        onCommit={(v) => update({ syncS: v })}
      />
      {length('Height', camera.heightM, 'heightM', 0.1)}
    </>
  );
}

const s = StyleSheet.create({
  wrap: { padding: space.lg },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18, marginBottom: space.md },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, marginBottom: space.sm },
  box: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.md, marginTop: space.sm },
  actions: { flexDirection: 'row', gap: space.sm, marginBottom: space.md, flexWrap: 'wrap' },
  action: { minHeight: 40, paddingHorizontal: space.md, borderRadius: 8, borderWidth: 1, borderColor: colours.line, justifyContent: 'center' },
  actionText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 13 },
});

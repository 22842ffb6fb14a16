// The setup's own settings: the stage's size, the room's ceiling, the room's ambient light (as EV at ISO 100,
// or metered from camera settings that gave a good ambient exposure) and the aperture the photographer is
// aiming for. Each change is one `updateDocument` action (one undo step).
import { memo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { exposureValue } from '../../calc';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { colours, fonts, space } from '../../constants/theme';
import { DEFAULT_CEILING_M, type SetupDocument } from '../../model/document';
import { formatFNumber, stepIn } from '../../model/fields';
import { isSegment } from '../../model/kinds';
import { APERTURE_THIRDS, ISO_THIRDS, SHUTTER_THIRDS, formatShutter, lengthText, parseLength, parseNumber, parseShutter, unitSuffix, type Units } from '../../model/units';
import { Button } from '../ui';
import { ChoiceField, NumberField, SwitchField } from './fields';

/** The furthest any item reaches across and down, metres: the stage may not shrink past it. */
function itemsExtent(doc: SetupDocument): { x: number; y: number } {
  let x = 0;
  let y = 0;
  for (const i of doc.items) {
    const pts = isSegment(i) ? [i.a, i.b] : [{ x: i.x, y: i.y }];
    for (const p of pts) {
      x = Math.max(x, p.x);
      y = Math.max(y, p.y);
    }
  }
  return { x, y };
}

const round2 = (v: number) => Math.round(v * 100) / 100;
const third = (v: number) => Math.round(v * 3) / 3;

export const SetupSettings = memo(function SetupSettings({ units }: { units: Units }) {
  const store = useEditorApi();
  const doc = useEditor((s) => s.doc);
  const readOnly = useEditor((s) => s.readOnly);
  const update = (patch: Partial<Pick<SetupDocument, 'ambientEv100' | 'targetAperture' | 'stage' | 'meter'>>) => store.dispatch('updateDocument', { patch });
  const extent = itemsExtent(doc);
  const len = (v: number) => lengthText(v, units);
  const read = (t: string) => parseLength(t, units);
  const ceiling = doc.meter.ceiling.heightM;
  const [ambientMode, setAmbientMode] = useState<'dark' | 'ev' | 'metered'>(doc.ambientEv100 === null ? 'dark' : 'ev');
  const mode = doc.ambientEv100 === null && ambientMode === 'ev' ? 'dark' : ambientMode;
  return (
    <View style={s.wrap} pointerEvents={readOnly ? 'none' : 'auto'} testID="setup-settings">
      <Text style={s.heading} role="heading" aria-level={2}>
        Room and target
      </Text>
      <Text style={s.sub} role="heading" aria-level={3}>
        Stage
      </Text>
      <NumberField
        label={`Stage width (${unitSuffix(units)})`}
        value={doc.stage.widthM}
        format={len}
        parse={read}
        range={{ min: Math.max(1, Math.ceil(extent.x * 10) / 10), max: 200 }}
        onCommit={(v) => update({ stage: { ...store.getState().doc.stage, widthM: round2(v) } })}
        onStep={(d) => update({ stage: { ...store.getState().doc.stage, widthM: Math.max(1, extent.x, Math.min(200, Math.round(store.getState().doc.stage.widthM + d))) } })}
        testID="stage-width"
      />
      <NumberField
        label={`Stage depth (${unitSuffix(units)})`}
        value={doc.stage.depthM}
        format={len}
        parse={read}
        range={{ min: Math.max(1, Math.ceil(extent.y * 10) / 10), max: 200 }}
        onCommit={(v) => update({ stage: { ...store.getState().doc.stage, depthM: round2(v) } })}
        onStep={(d) => update({ stage: { ...store.getState().doc.stage, depthM: Math.max(1, extent.y, Math.min(200, Math.round(store.getState().doc.stage.depthM + d))) } })}
        testID="stage-depth"
      />
      <SwitchField label="Indoors, under a ceiling" value={ceiling !== null} onChange={(on) => update({ meter: { ...doc.meter, ceiling: { ...doc.meter.ceiling, heightM: on ? DEFAULT_CEILING_M : null } } })} />
      {ceiling !== null ? (
        <NumberField
          label={`Ceiling height (${unitSuffix(units)})`}
          value={ceiling}
          format={len}
          parse={read}
          range={{ min: 1, max: 50 }}
          onCommit={(v) => update({ meter: { ...doc.meter, ceiling: { ...doc.meter.ceiling, heightM: round2(v) } } })}
          onStep={(d) => update({ meter: { ...doc.meter, ceiling: { ...doc.meter.ceiling, heightM: Math.min(50, Math.max(1, round2(ceiling + d * 0.1))) } } })}
          testID="ceiling-height"
        />
      ) : null}

      <Text style={s.sub} role="heading" aria-level={3}>
        Room light
      </Text>
      <ChoiceField
        label="The room's own light"
        value={mode}
        options={[
          { id: 'dark', label: 'dark (does not matter)' },
          { id: 'ev', label: 'EV at ISO 100' },
          { id: 'metered', label: 'meter the room' },
        ]}
        onChange={(v) => {
          setAmbientMode(v);
          if (v === 'dark') update({ ambientEv100: null });
          if (v === 'ev' && doc.ambientEv100 === null) update({ ambientEv100: 8 });
        }}
      />
      {mode === 'ev' ? (
        <NumberField
          label="Ambient (EV at ISO 100)"
          value={doc.ambientEv100 ?? 8}
          format={(v) => (Math.abs(v - Math.round(v)) < 0.05 ? v.toFixed(0) : v.toFixed(1))}
          parse={parseNumber}
          range={{ min: -10, max: 24 }}
          onCommit={(v) => update({ ambientEv100: Math.round(v * 10) / 10 })}
          onStep={(d) => update({ ambientEv100: Math.min(24, Math.max(-10, third((store.getState().doc.ambientEv100 ?? 8) + d / 3))) })}
          testID="ambient-ev"
        />
      ) : null}
      {mode === 'metered' ? <MeterTheRoom onUse={(ev) => {
        update({ ambientEv100: ev });
        setAmbientMode('ev');
      }} /> : null}

      <Text style={s.sub} role="heading" aria-level={3}>
        Target
      </Text>
      <SwitchField label="Aim for an aperture" value={doc.targetAperture !== null} onChange={(on) => update({ targetAperture: on ? (doc.items.find((i) => i.kind === 'camera') as { aperture?: number } | undefined)?.aperture ?? 8 : null })} />
      {doc.targetAperture !== null ? (
        <NumberField
          label="Target aperture (f/)"
          value={doc.targetAperture}
          format={formatFNumber}
          parse={parseNumber}
          range={{ min: 0.7, max: 128 }}
          onCommit={(v) => update({ targetAperture: v })}
          onStep={(d) => update({ targetAperture: stepIn(APERTURE_THIRDS, store.getState().doc.targetAperture ?? 8, d) })}
          testID="target-aperture"
        />
      ) : null}
    </View>
  );
});

/**
 * "Meter the room": the camera settings that gave a good exposure of the room's own light (from a meter or a
 * test frame); EV at ISO 100 = log2(N²/t) − log2(ISO/100) (APEX, the same formula the meter uses).
 */
function MeterTheRoom({ onUse }: { onUse: (ev100: number) => void }) {
  const [aperture, setAperture] = useState(4);
  const [shutterS, setShutter] = useState(1 / 60);
  const [iso, setIso] = useState(800);
  const ev = Math.round(exposureValue({ aperture, shutterS, iso }) * 10) / 10;
  return (
    <View style={s.box} testID="meter-the-room">
      <Text style={s.note}>Settings that gave a good exposure of the room with no flash:</Text>
      <NumberField label="Room aperture (f/)" value={aperture} format={formatFNumber} parse={parseNumber} range={{ min: 0.7, max: 128 }} onCommit={setAperture} onStep={(d) => setAperture(stepIn(APERTURE_THIRDS, aperture, d))} />
      <NumberField label="Room shutter (s)" value={shutterS} format={formatShutter} parse={parseShutter} range={{ min: 1 / 8000, max: 30 }} onCommit={setShutter} onStep={(d) => setShutter(stepIn(SHUTTER_THIRDS, shutterS, -d))} />
      <NumberField label="Room ISO" value={iso} format={(v) => v.toFixed(0)} parse={parseNumber} range={{ min: 25, max: 409600 }} onCommit={setIso} onStep={(d) => setIso(stepIn(ISO_THIRDS, iso, d))} />
      <Text style={s.result} testID="room-ev">
        That is EV {ev.toFixed(1)} at ISO 100.
      </Text>
      <Button kind="quiet" label={`Use EV ${ev.toFixed(1)}`} onPress={() => onUse(ev)} />
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { padding: space.lg },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18, marginBottom: space.md },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, marginTop: space.sm, marginBottom: space.sm },
  box: { borderWidth: 1, borderColor: colours.line, borderRadius: 10, padding: space.md, marginBottom: space.md },
  note: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, marginBottom: space.sm },
  result: { color: colours.text, fontFamily: fonts.mono, fontSize: 14, marginVertical: space.sm },
});

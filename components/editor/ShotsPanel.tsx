import { memo } from 'react';
// The shot list: the frames to make with this setup (wide, medium, tight) with lens and settings.
import { StyleSheet, Text, View } from 'react-native';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { colours, fonts, space } from '../../constants/theme';
import type { Shot } from '../../model/document';
import { stepIn } from '../../model/fields';
import { APERTURE_THIRDS, ISO_THIRDS, SHUTTER_THIRDS, formatAperture, formatShutter, parseNumber, parseShutter } from '../../model/units';
import { Button } from '../ui';
import { ChoiceField, NumberField, TextField } from './fields';

const num = parseNumber;
const shutter = parseShutter;

export const ShotsPanel = memo(function ShotsPanel() {
  const store = useEditorApi();
  const shots = useEditor((s) => s.doc.shots);
  const camera = useEditor((s) => s.doc.items.find((i) => i.kind === 'camera'));
  const readOnly = useEditor((s) => s.readOnly);
  const set = (next: Shot[]) => store.dispatch('setShots', { shots: next });
  // Read the list at the moment of the change: a field's callback may be older than the list.
  const change = (id: string, patch: Partial<Shot>) => set(store.getState().doc.shots.map((x) => (x.id === id ? { ...x, ...patch } : x)));
  const add = () => {
    const c = camera?.kind === 'camera' ? camera : null;
    let id = `shot-${shots.length + 1}`;
    while (shots.some((s) => s.id === id)) id = `${id}x`;
    set([...shots, { id, framing: 'medium', focalMm: c?.focalMm ?? 85, aperture: c?.aperture ?? 8, shutterS: c?.shutterS ?? 1 / 200, iso: c?.iso ?? 100, note: '' }]);
  };
  return (
    <View style={s.wrap} accessibilityLabel="Shot list">
      <Text style={s.heading}>Shot list</Text>
      {shots.length === 0 ? <Text style={s.dim}>No shots yet. Add the frames you plan: a wide to show the set, a medium, a tight.</Text> : null}
      {shots.map((sh, i) =>
        readOnly ? (
          <Text key={sh.id} style={s.line}>
            {i + 1}. {sh.framing} · {sh.focalMm} mm · {formatAperture(sh.aperture)} · {formatShutter(sh.shutterS)} · ISO {sh.iso} {sh.note ? `— ${sh.note}` : ''}
          </Text>
        ) : (
          <View key={sh.id} style={s.shot}>
            <ChoiceField label={`Shot ${i + 1}`} value={sh.framing} options={[{ id: 'wide', label: 'wide' }, { id: 'medium', label: 'medium' }, { id: 'tight', label: 'tight' }]} onChange={(v) => change(sh.id, { framing: v })} />
            <NumberField label="Lens (mm)" value={sh.focalMm} format={(v) => v.toFixed(0)} parse={num} range={{ min: 4, max: 2000 }} onCommit={(v) => change(sh.id, { focalMm: v })} />
            <NumberField label="Aperture (f/)" value={sh.aperture} format={(v) => formatAperture(v).slice(2)} parse={num} range={{ min: 0.7, max: 128 }} onCommit={(v) => change(sh.id, { aperture: v })} onStep={(d) => change(sh.id, { aperture: stepIn(APERTURE_THIRDS, sh.aperture, d) })} />
            <NumberField label="Shutter" value={sh.shutterS} format={formatShutter} parse={shutter} range={{ min: 1 / 8000, max: 30 }} onCommit={(v) => change(sh.id, { shutterS: v })} onStep={(d) => change(sh.id, { shutterS: stepIn(SHUTTER_THIRDS, sh.shutterS, -d) })} />
            <NumberField label="ISO" value={sh.iso} format={(v) => v.toFixed(0)} parse={num} range={{ min: 25, max: 409600 }} onCommit={(v) => change(sh.id, { iso: v })} onStep={(d) => change(sh.id, { iso: stepIn(ISO_THIRDS, sh.iso, d) })} />
            <TextField label="Note" value={sh.note} onCommit={(v) => change(sh.id, { note: v })} />
            <Button kind="quiet" label="Remove shot" onPress={() => set(store.getState().doc.shots.filter((x) => x.id !== sh.id))} />
          </View>
        ),
      )}
      {!readOnly ? <Button kind="quiet" label="Add a shot" onPress={add} /> : null}
    </View>
  );
});

const s = StyleSheet.create({
  wrap: { padding: space.lg, gap: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12 },
  line: { color: colours.text, fontFamily: fonts.mono, fontSize: 13 },
  shot: { borderWidth: 1, borderColor: colours.line, borderRadius: 10, padding: space.md },
});

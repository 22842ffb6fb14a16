// The frame view: what the camera will record, beside the plan (wide: a pane that can be enlarged) or as a tab
// of the sheet (phone: with a full-screen view). Looks: colour or black and white, clipping, stops; the
// subject's skin tone. Rendered progressively off the UI thread (useFrame → engine → Web Worker).
import { useState } from 'react';
import { Image, Modal, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { FRAME_LIMITS } from '../../calc/frame/limits';
import { SKIN_TONES, SKIN_TONE_IDS, type SkinTone } from '../../calc/frame/scene';
import { colours, fonts, space } from '../../constants/theme';
import type { ItemOf, SetupDocument } from '../../model/document';
import { useFrame } from './useFrame';

export type Look = { mono: boolean; clipping: boolean; contours: boolean };

export function FrameView({ doc, stepIndex, paneWidth, onSkinTone, testID = 'frame' }: { doc: SetupDocument; stepIndex?: number; paneWidth: number; onSkinTone?: (tone: SkinTone) => void; testID?: string }) {
  const [look, setLook] = useState<Look>({ mono: false, clipping: false, contours: false });
  const [big, setBig] = useState(false);
  const win = useWindowDimensions();
  const subject = doc.items.find((i): i is ItemOf<'subject'> => i.kind === 'subject');
  return (
    <View style={s.root} testID={`${testID}-view`}>
      <FramePicture doc={doc} stepIndex={stepIndex} width={paneWidth} look={look} testID={`${testID}-picture`} />
      <Toggles look={look} setLook={setLook} onEnlarge={() => setBig(true)} />
      {subject && onSkinTone ? (
        <View style={s.row} accessibilityLabel="Skin tone">
          <Text style={s.label}>Skin</Text>
          {SKIN_TONE_IDS.map((t) => (
            <Pressable
              key={t}
              accessibilityRole="button"
              accessibilityLabel={`Skin tone ${SKIN_TONES[t].label}`}
              accessibilityState={{ selected: subject.skinTone === t }}
              aria-pressed={subject.skinTone === t}
              onPress={() => onSkinTone(t)}
              style={[s.swatch, { backgroundColor: swatch(t) }, subject.skinTone === t && s.swatchOn]}
            />
          ))}
        </View>
      ) : null}
      <Text style={s.limits} testID={`${testID}-limits`}>
        {FRAME_LIMITS}
      </Text>
      <Modal visible={big} animationType="fade" onRequestClose={() => setBig(false)}>
        <View style={s.full}>
          <ScrollView contentContainerStyle={{ padding: space.md, gap: space.sm }}>
            <FramePicture doc={doc} stepIndex={stepIndex} width={Math.min(1600, Math.round(win.width - 2 * space.md))} look={look} testID={`${testID}-picture-large`} />
            <Toggles look={look} setLook={setLook} onClose={() => setBig(false)} />
            <Text style={s.limits}>{FRAME_LIMITS}</Text>
          </ScrollView>
        </View>
      </Modal>
    </View>
  );
}

export function FramePicture({ doc, stepIndex, width, look, testID }: { doc: SetupDocument; stepIndex?: number; width: number; look: Look; testID: string }) {
  const w = Math.max(120, Math.round(width));
  const f = useFrame(doc, { stepIndex, width: w, look });
  const img = f.image;
  const h = img ? Math.round((w * img.height) / img.width) : Math.round((w * 2) / 3);
  return (
    <View style={[s.picture, { width: w, height: h }]} testID={testID} accessibilityLabel="The frame: what the camera will record">
      {img?.uri ? <Image source={{ uri: img.uri }} style={{ width: w, height: h }} resizeMode="stretch" testID={`${testID}-image`} /> : null}
      {!img ? <Text style={s.wait}>{f.missing.length ? `Add ${f.missing.join(' and ')} to see the frame` : 'Rendering the frame…'}</Text> : null}
      {img ? (
        <Text style={s.badge} testID={`${testID}-quality`}>
          {img.quality === 'refined' ? `${img.width} px · ${Math.round(img.ms)} ms` : 'draft'}
        </Text>
      ) : null}
      {f.error ? <Text style={s.wait}>{f.error}</Text> : null}
    </View>
  );
}

export function Toggles({ look, setLook, onEnlarge, onClose }: { look: Look; setLook: (l: Look) => void; onEnlarge?: () => void; onClose?: () => void }) {
  return (
    <View style={s.row}>
      <Chip label={look.mono ? 'Black and white' : 'Colour'} a11y={look.mono ? 'Black and white' : 'Colour, switch to black and white'} on={look.mono} onPress={() => setLook({ ...look, mono: !look.mono })} />
      <Chip label="Clipping" a11y="Show clipping" on={look.clipping} onPress={() => setLook({ ...look, clipping: !look.clipping })} />
      <Chip label="Stops" a11y="Stops: show the one-stop lines" on={look.contours} onPress={() => setLook({ ...look, contours: !look.contours })} />
      {onEnlarge ? <Chip label="Enlarge" a11y="Enlarge the frame" on={false} onPress={onEnlarge} /> : null}
      {onClose ? <Chip label="Close" a11y="Close the large frame" on={false} onPress={onClose} /> : null}
    </View>
  );
}

function Chip({ label, a11y, on, onPress }: { label: string; a11y: string; on: boolean; onPress: () => void }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={a11y} accessibilityState={{ selected: on }} aria-pressed={on} onPress={onPress} style={[s.chip, on && s.chipOn]}>
      <Text style={[s.chipText, on && { color: colours.accent }]}>{label}</Text>
    </Pressable>
  );
}

/** A swatch colour for each tone (display only): its reflectance as a grey with a warm cast. */
function swatch(t: SkinTone): string {
  const y = SKIN_TONES[t].reflectance;
  const v = (k: number) => Math.round(255 * Math.min(1, Math.pow(Math.min(1, y * k), 1 / 2.2)));
  return `rgb(${v(1.32)}, ${v(0.95)}, ${v(0.76)})`;
}

const s = StyleSheet.create({
  root: { padding: space.md, gap: space.sm },
  picture: { backgroundColor: '#000', borderRadius: 4, overflow: 'hidden', alignItems: 'center', justifyContent: 'center' },
  wait: { position: 'absolute', color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, textAlign: 'center', padding: space.md },
  badge: { position: 'absolute', right: 6, bottom: 4, color: '#fffc', fontFamily: fonts.mono, fontSize: 10, backgroundColor: '#0008', paddingHorizontal: 4, borderRadius: 3 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: 6, alignItems: 'center' },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 12, marginRight: 4 },
  chip: { borderWidth: 1, borderColor: colours.line, borderRadius: 14, paddingHorizontal: 10, paddingVertical: 6, minHeight: 32, justifyContent: 'center' },
  chipOn: { borderColor: colours.accent },
  chipText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 12 },
  swatch: { width: 28, height: 28, borderRadius: 14, borderWidth: 2, borderColor: 'transparent' },
  swatchOn: { borderColor: colours.accent },
  limits: { color: colours.textFaint, fontFamily: fonts.sans, fontSize: 11 },
  full: { flex: 1, backgroundColor: colours.graphite },
});

import { memo } from 'react';
// The kit palette: every kind of plan item, grouped as a photographer packs them. Tapping one adds it near
// the middle of what is on screen, in a free spot.
import { Pressable, StyleSheet, Text, View } from 'react-native';
import Svg from 'react-native-svg';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { ItemView, graphiteTheme } from '../../canvas/views';
import { colours, fonts, space } from '../../constants/theme';
import type { ItemKind } from '../../model/document';
import { createItem, kindOrder, kinds } from '../../model/kinds';

const groups: { id: (typeof kinds)[ItemKind]['group']; label: string }[] = [
  { id: 'people', label: 'Set' },
  { id: 'camera', label: 'Camera' },
  { id: 'light', label: 'Lights' },
  { id: 'shaper', label: 'Shapers' },
  { id: 'room', label: 'Room' },
  { id: 'note', label: 'Notes' },
];

/** A kind's own glyph, as the plan draws it, for a kit button. */
export function KitGlyph({ kind, size = 36, halfM = 0.8 }: { kind: ItemKind; size?: number; halfM?: number }) {
  const item = { ...createItem(kind, 'preview', { x: 0, y: 0 }), label: '' };
  return (
    <Svg width={size} height={size} viewBox={`${-halfM} ${-halfM} ${2 * halfM} ${2 * halfM}`}>
      <ItemView item={item} theme={graphiteTheme} units="metric" />
    </Svg>
  );
}

/** What a kit button does: a wall is drawn (the next drag on the plan runs from one end to the other); any other
 *  kind lands in a free spot near the middle of the view, a camera or light aimed at the subject
 *  (canvas/editor/placement.ts). */
export function addFromKit(store: ReturnType<typeof useEditorApi>, kind: ItemKind) {
  if (kind === 'wall') store.dispatch('setTool', { tool: 'wall' });
  else store.dispatch('placeItem', { kind });
}

/** A kit button's name: what it does. */
export const kitButtonName = (kind: ItemKind) => (kind === 'wall' ? 'Draw a wall' : `Add ${kinds[kind].label.toLowerCase()}`);

export const Palette = memo(function Palette({ onAdded }: { onAdded?: () => void }) {
  const store = useEditorApi();
  const readOnly = useEditor((s) => s.readOnly);
  const add = (kind: ItemKind) => {
    addFromKit(store, kind);
    onAdded?.();
  };
  if (readOnly) return null;
  return (
    <View style={s.wrap} accessibilityLabel="Kit" testID="kit">
      <Text style={s.heading}>Kit</Text>
      {groups.map((g) => (
        <View key={g.id} style={s.group}>
          <Text style={s.groupLabel}>{g.label}</Text>
          <View style={s.grid}>
            {kindOrder
              .filter((k) => kinds[k].group === g.id)
              .map((k) => (
                // The glyph and its word are a picture under the button (a glyph's own numbers, a tape's length,
                // would otherwise read as part of the button's name); the button over them says what it does.
                <View key={k} style={s.tile}>
                  <View aria-hidden pointerEvents="none" style={s.tileFace}>
                    <KitGlyph kind={k} />
                    <Text style={s.tileText}>{kinds[k].label}</Text>
                  </View>
                  <Pressable accessibilityRole="button" accessibilityLabel={kitButtonName(k)} onPress={() => add(k)} style={({ pressed }) => [StyleSheet.absoluteFill, s.tileHit, pressed && { backgroundColor: '#ffffff14' }]} />
                </View>
              ))}
          </View>
        </View>
      ))}
    </View>
  );
});

const s = StyleSheet.create({
  wrap: { padding: space.lg },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18, marginBottom: space.sm },
  group: { marginBottom: space.md },
  groupLabel: { color: colours.textFaint, fontFamily: fonts.sansMedium, fontSize: 11, letterSpacing: 1, textTransform: 'uppercase', marginBottom: space.xs },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 6 },
  tile: { width: 76, height: 68, borderRadius: 10, borderWidth: 1, borderColor: colours.line },
  tileFace: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: 2 },
  tileHit: { borderRadius: 10 },
  tileText: { color: colours.text, fontFamily: fonts.sans, fontSize: 11, textAlign: 'center' },
});

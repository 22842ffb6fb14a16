import { memo } from 'react';
// The kit palette: every kind of plan item, grouped as a photographer packs them. Tapping one adds it near
// the middle of what is on screen (the subject's side of the stage when there is one).
import { Pressable, StyleSheet, Text, View } from 'react-native';
import Svg from 'react-native-svg';
import { useEditor, useEditorStore } from '../../canvas/state/store';
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

function Preview({ kind }: { kind: ItemKind }) {
  const item = { ...createItem(kind, 'preview', { x: 0, y: 0 }), label: '' };
  return (
    <Svg width={36} height={36} viewBox="-0.8 -0.8 1.6 1.6">
      <ItemView item={item} theme={graphiteTheme} units="metric" />
    </Svg>
  );
}

export const Palette = memo(function Palette({ onAdded }: { onAdded?: () => void }) {
  const store = useEditorStore();
  const readOnly = useEditor((s) => s.readOnly);
  const add = (kind: ItemKind) => {
    if (kind === 'wall') {
      // Walls are drawn: the next drag on the plan runs from one end to the other.
      store.dispatch('setTool', { tool: 'wall' });
      onAdded?.();
      return;
    }
    const { doc } = store.getState();
    const subject = doc.items.find((i) => i.kind === 'subject') as { x: number; y: number } | undefined;
    const at = subject ? { x: Math.min(doc.stage.widthM - 0.5, subject.x + 1), y: Math.min(doc.stage.depthM - 0.5, subject.y + 1) } : { x: doc.stage.widthM / 2, y: doc.stage.depthM / 2 };
    store.dispatch('addItem', { kind, at });
    onAdded?.();
  };
  if (readOnly) return null;
  return (
    <View style={s.wrap} accessibilityLabel="Kit">
      <Text style={s.heading}>Kit</Text>
      {groups.map((g) => (
        <View key={g.id} style={s.group}>
          <Text style={s.groupLabel}>{g.label}</Text>
          <View style={s.grid}>
            {kindOrder
              .filter((k) => kinds[k].group === g.id)
              .map((k) => (
                <Pressable key={k} accessibilityRole="button" accessibilityLabel={k === 'wall' ? 'Draw a wall' : `Add ${kinds[k].label.toLowerCase()}`} onPress={() => add(k)} style={({ pressed }) => [s.tile, pressed && { backgroundColor: colours.panelRaised }]}>
                  <Preview kind={k} />
                  <Text style={s.tileText}>{kinds[k].label}</Text>
                </Pressable>
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
  tile: { width: 76, height: 68, borderRadius: 10, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center', gap: 2 },
  tileText: { color: colours.text, fontFamily: fonts.sans, fontSize: 11, textAlign: 'center' },
});

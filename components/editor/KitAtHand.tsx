// Kit at hand: one row of the items a photographer adds most — subject, camera, a light (it comes with a
// softbox), a reflector, a flag and a wall — each one tap from the plan. At the top of the phone's sheet (seen at
// every height) and over the plan on a wide screen; the whole kit stays one button away. Every button is at
// least 48 × 52 px (touch targets ≥ 44 px) with the kind's own plan glyph at 30 px and its word under it.
import { memo, useRef } from 'react';
import { type GestureResponderEvent, Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { colours, fonts } from '../../constants/theme';
import type { ItemKind } from '../../model/document';
import { kinds } from '../../model/kinds';
import { KitGlyph, addFromKit, kitButtonName } from './Palette';

/** The row's kinds, in the order a look is usually built (common practice: set, camera, light, then shaping). */
export const KIT_AT_HAND: readonly ItemKind[] = ['subject', 'camera', 'light', 'reflector', 'flag', 'wall'];

/** How much of the plan each button's glyph shows around the item (half the side, metres): close on the small
 *  heads and bodies so the glyph fills the button, wider for panels and a wall. */
const GLYPH_HALF_M: Partial<Record<ItemKind, number>> = { subject: 0.3, camera: 0.26, light: 0.34, reflector: 0.55, flag: 0.55, wall: 0.7 };

/** The short word under each glyph. */
const word = (k: ItemKind) => (k === 'light' ? 'Light' : kinds[k].label);

/** A press whose finger travelled further than this (px, on the page) was a drag, not a tap. */
export const KIT_TAP_SLOP_PX = 10;

const at = (e: GestureResponderEvent) => ({ x: e.nativeEvent.pageX, y: e.nativeEvent.pageY });

/** Was this press a tap: the finger lifted within KIT_TAP_SLOP_PX of where it went down (a key or a screen
 *  reader's press has no position and always counts). On the phone the row
 *  rides in the sheet's header, so a hand that drags the sheet up by the row carries the button along under the
 *  finger and the press would fire on release, adding an item nobody asked for. */
export function wasTap(down: { x: number; y: number } | null, up: { x: number; y: number }): boolean {
  // A key or a screen reader presses without a pointer (no position): always a tap.
  const placed = (p: { x: number; y: number } | null): p is { x: number; y: number } => p !== null && Number.isFinite(p.x) && Number.isFinite(p.y);
  if (!placed(down) || !placed(up)) return true;
  return Math.hypot(up.x - down.x, up.y - down.y) <= KIT_TAP_SLOP_PX;
}

export const KitAtHand = memo(function KitAtHand({ onAdded, testID }: { onAdded?: (kind: ItemKind) => void; testID?: string }) {
  const store = useEditorApi();
  const readOnly = useEditor((s) => s.readOnly);
  const down = useRef<{ x: number; y: number } | null>(null);
  if (readOnly) return null;
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={s.row} accessibilityLabel="Kit at hand" testID={testID}>
      {KIT_AT_HAND.map((k) => (
        <Pressable
          key={k}
          accessibilityRole="button"
          accessibilityLabel={kitButtonName(k)}
          onPressIn={(e) => {
            down.current = at(e);
          }}
          onPress={(e) => {
            const tap = wasTap(down.current, at(e));
            down.current = null;
            if (!tap) return;
            addFromKit(store, k);
            onAdded?.(k);
          }}
          style={({ pressed }) => [s.button, pressed && s.pressed]}
        >
          <View aria-hidden pointerEvents="none" style={s.face}>
            <KitGlyph kind={k} size={30} halfM={GLYPH_HALF_M[k]} />
            <Text style={s.word} numberOfLines={1}>
              {word(k)}
            </Text>
          </View>
        </Pressable>
      ))}
    </ScrollView>
  );
});

const s = StyleSheet.create({
  row: { flexDirection: 'row', gap: 4, paddingHorizontal: 8 },
  button: { minWidth: 56, height: 54, paddingHorizontal: 2, borderRadius: 10, borderWidth: 1, borderColor: colours.line, backgroundColor: colours.panel, alignItems: 'center', justifyContent: 'center' },
  pressed: { backgroundColor: colours.panelRaised },
  face: { alignItems: 'center', justifyContent: 'center' },
  word: { color: colours.text, fontFamily: fonts.sans, fontSize: 11, marginTop: 1 },
});

// A modal panel: a sheet from the bottom on a phone, a centred card on a wide screen. Closing by the
// backdrop or the back gesture calls onClose.
import type { ReactNode } from 'react';
import { Modal, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { TABLET_MIN, colours, fonts, radius, space } from '../constants/theme';

export function Dialog({ visible, title, onClose, children, label }: { visible: boolean; title: string; onClose: () => void; children: ReactNode; label?: string }) {
  const { width } = useWindowDimensions();
  const sheet = width < TABLET_MIN;
  return (
    <Modal visible={visible} transparent animationType={sheet ? 'slide' : 'fade'} onRequestClose={onClose}>
      <View style={[s.backdrop, sheet ? s.bottom : s.centre]}>
        <Pressable style={StyleSheet.absoluteFill} onPress={onClose} accessibilityLabel="Close" accessibilityRole="button" />
        <View style={[s.panel, sheet ? s.sheet : s.card]} accessibilityViewIsModal role="dialog" aria-label={label ?? title}>
          <Text role="heading" aria-level={2} style={s.title}>
            {title}
          </Text>
          <ScrollView keyboardShouldPersistTaps="handled">{children}</ScrollView>
        </View>
      </View>
    </Modal>
  );
}

/** A row of buttons at the end of a dialog, the main one last. */
export function DialogActions({ children }: { children: ReactNode }) {
  return <View style={s.actions}>{children}</View>;
}

const s = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: 'rgba(8,9,10,0.6)' },
  bottom: { justifyContent: 'flex-end' },
  centre: { justifyContent: 'center', alignItems: 'center', padding: space.xl },
  panel: { backgroundColor: colours.panel, borderColor: colours.line, borderWidth: 1, padding: space.lg, maxHeight: '90%' },
  sheet: { borderTopLeftRadius: radius.lg, borderTopRightRadius: radius.lg, paddingBottom: space.xl },
  card: { borderRadius: radius.lg, width: '100%', maxWidth: 480 },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 20, marginBottom: space.md },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm, marginTop: space.md, flexWrap: 'wrap' },
});

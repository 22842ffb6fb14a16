// "A new version is ready — Reload": shown when a new build's service worker is installed and waiting. Reload
// first saves open editors and sends the queued changes; the page reloads only when none is left on the device.
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { applyUpdate, useUpdateReady } from '../../hooks/offline';

export function UpdateBanner() {
  const ready = useUpdateReady();
  const qc = useQueryClient();
  const [busy, setBusy] = useState(false);
  const [left, setLeft] = useState(0);
  if (!ready) return null;
  const reload = async () => {
    setBusy(true);
    try {
      const n = await applyUpdate(qc);
      setLeft(n);
      if (n > 0) setBusy(false);
    } catch {
      setBusy(false);
    }
  };
  return (
    <View style={s.bar} accessibilityRole="alert" accessibilityLiveRegion="polite" testID="update-banner">
      <Text style={s.text}>
        {left > 0
          ? `A new version is ready — ${left} change${left === 1 ? '' : 's'} still waiting to be sent; reload once ${left === 1 ? 'it is' : 'they are'}`
          : 'A new version is ready'}
      </Text>
      <Pressable accessibilityRole="button" accessibilityLabel="Reload to the new version" disabled={busy} onPress={() => void reload()} style={s.button} testID="update-reload">
        <Text style={s.buttonText}>{busy ? 'Saving…' : 'Reload'}</Text>
      </Pressable>
    </View>
  );
}

const s = StyleSheet.create({
  bar: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm, paddingHorizontal: space.lg, paddingVertical: space.xs, backgroundColor: colours.panelRaised, borderBottomWidth: 1, borderBottomColor: colours.accent },
  text: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, flexShrink: 1 },
  button: { minHeight: 44, justifyContent: 'center', paddingHorizontal: space.md, borderRadius: radius.md, backgroundColor: colours.accent },
  buttonText: { color: colours.accentText, fontFamily: fonts.sansMedium, fontSize: 14 },
});

// "Keep offline" for one setup: its JSON, plan image, crew sheet and frame stay on this device (for studios in
// basements and locations without signal). On: fetched now and refreshed whenever they are fetched online.
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { formatWhen } from '../../model/format';
import { dropOffline, keepOffline, useKeptSetup, useOnline } from '../../hooks/offline';
import { ErrorText } from '../ui';

export function KeepOfflineToggle({ setupId, title, version, paper }: { setupId: string; title: string; version: number; paper: string }) {
  const kept = useKeptSetup(setupId);
  const online = useOnline();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const on = !!kept;
  const toggle = async () => {
    setBusy(true);
    setError(null);
    try {
      if (on) await dropOffline(setupId);
      else await keepOffline(setupId, { title, version, paper });
    } catch (e) {
      setError(`Could not keep it offline: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setBusy(false);
    }
  };
  const note = busy
    ? on
      ? 'Removing from this device…'
      : 'Storing the plan, crew sheet and frame on this device…'
    : on
      ? `On this device since ${formatWhen(kept.at)}: opens without signal.`
      : online
        ? 'Store the plan, crew sheet and frame on this device to open them without signal.'
        : 'Needs a connection to store it.';
  return (
    <View style={s.wrap}>
      <Pressable
        accessibilityRole="switch"
        accessibilityLabel="Keep offline"
        accessibilityState={{ checked: on, disabled: busy || (!on && !online), busy }}
        aria-checked={on}
        aria-busy={busy}
        disabled={busy || (!on && !online) || kept === undefined}
        onPress={() => void toggle()}
        style={s.row}
        testID="keep-offline"
      >
        <View style={{ flex: 1 }}>
          <Text style={s.label}>Keep offline</Text>
          <Text style={s.note} testID="keep-offline-note">
            {note}
          </Text>
        </View>
        <View style={[s.track, on && { backgroundColor: colours.accent, borderColor: colours.accent }]}>
          <View style={[s.knob, on && { transform: [{ translateX: 18 }], backgroundColor: colours.accentText }]} />
        </View>
      </Pressable>
      {error ? <ErrorText>{error}</ErrorText> : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { gap: space.xs },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: 48, paddingVertical: space.sm },
  label: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  note: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, marginTop: 2 },
  track: { width: 44, height: 26, borderRadius: radius.lg, borderWidth: 1, borderColor: colours.line, backgroundColor: colours.panelRaised, padding: 3 },
  knob: { width: 18, height: 18, borderRadius: 9, backgroundColor: colours.textDim },
});

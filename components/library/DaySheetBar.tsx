// Sheets for a shoot day: while picking, the library's cards are tapped in shooting order; this bar says how
// many are chosen and makes one PDF of their crew sheets behind a cover (POST /api/day-sheet.pdf).
import { useState } from 'react';
import { StyleSheet, Text, TextInput, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import type { DaySheetBody } from '../../model/api';
import { kb } from '../../model/format';
import type { Progress } from '../crew/download';
import { Button, ErrorText } from '../ui';

export function DaySheetBar({ chosen, onDone }: { chosen: string[]; onDone: () => void }) {
  const [title, setTitle] = useState('');
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [progress, setProgress] = useState<Progress | null>(null);
  const make = async () => {
    setBusy(true);
    setError(null);
    setProgress(null);
    try {
      const body: DaySheetBody = { setupIds: chosen, ...(title.trim() ? { title: title.trim() } : {}) };
      // Loaded when asked for: the download code stays out of the library's (and the sign-in page's) first scripts.
      const { downloadWithProgress } = await import('../crew/download');
      await downloadWithProgress({ url: '/api/day-sheet.pdf', method: 'POST', body }, null, setProgress);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'the day sheets could not be made');
    } finally {
      setBusy(false);
      setProgress(null);
    }
  };
  return (
    <View style={s.bar} testID="day-sheet-bar">
      <Text style={s.text}>{chosen.length ? `${chosen.length} chosen, in the order tapped` : 'Tap setups in shooting order'}</Text>
      <TextInput accessibilityLabel="Name of the shoot day" value={title} onChangeText={setTitle} placeholder="Shoot day" placeholderTextColor={colours.textFaint} style={s.input} />
      {busy ? <Text style={s.text}>{progress && progress.loaded > 0 ? `Downloading… ${kb(progress.loaded)}` : 'Making the day sheets…'}</Text> : null}
      {error ? <ErrorText>{error}</ErrorText> : null}
      <View style={s.row}>
        <Button label="Make the day sheets" onPress={make} disabled={!chosen.length} busy={busy} testID="make-day-sheets" />
        <Button kind="quiet" label="Done" onPress={onDone} />
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  bar: { borderTopWidth: 1, borderTopColor: colours.line, backgroundColor: colours.panel, padding: space.md, gap: space.sm },
  text: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  row: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  input: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, backgroundColor: colours.graphite, borderWidth: 1, borderColor: colours.line, borderRadius: 10, paddingHorizontal: space.md, minHeight: 44 },
});

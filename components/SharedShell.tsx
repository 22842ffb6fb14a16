// The read-only link's page before its plan and its setup have arrived: the page's own frame (background,
// column, the brand line) and a line saying what is coming, so the page paints words at once instead of a
// spinner while the share chunk and the setup download (it is the route's fallback and the screen's pending
// state). Small on purpose: with the share link's route it is in the chunk every page downloads first
// (scripts/chunkTiers.cjs), under 1 KB.
import { StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../constants/theme';

export function SharedShell() {
  return (
    <View style={s.page} testID="shared-shell">
      <View style={s.column}>
        <Text style={s.brand}>FALLOFF · READ-ONLY</Text>
        <Text style={s.line}>Opening the shared setup…</Text>
      </View>
    </View>
  );
}

// The same frame as SharedSetupScreen's page, column and brand line.
const s = StyleSheet.create({
  page: { flex: 1, backgroundColor: colours.graphite },
  column: { width: '100%', maxWidth: 760, alignSelf: 'center', paddingHorizontal: space.lg, gap: space.md, paddingTop: space.md },
  brand: { color: colours.accent, fontFamily: fonts.monoMedium, fontSize: 11, letterSpacing: 2, marginTop: space.md },
  line: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 15 },
});

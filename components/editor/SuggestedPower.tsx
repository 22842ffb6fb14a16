// One tap to set the selected light to the meter's suggested power, and one tap to take it back.
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { MeterResult } from '../../calc';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { colours, fonts, space } from '../../constants/theme';
import { formatAperture, formatPower } from '../../model/units';
import { Button } from '../ui';
import { suggestedPower } from './suggestedPower';

export function SuggestedPower({ result }: { result: MeterResult | null }) {
  const editor = useEditorApi();
  const lightId = useEditor((s) => (s.selection.length === 1 && s.doc.items.find((i) => i.id === s.selection[0])?.kind === 'light' ? s.selection[0]! : null));
  const readOnly = useEditor((s) => s.readOnly);
  const revision = useEditor((s) => s.revision);
  const [applied, setApplied] = useState<{ revision: number; lightId: string; power: string } | null>(null);
  if (!lightId || readOnly) return null;
  // The change just made is still the last one: offer to take it back.
  if (applied && applied.lightId === lightId && applied.revision === revision) {
    return (
      <View style={s.row} testID="suggested-power">
        <Text style={s.text}>Power set to {applied.power}.</Text>
        <Button
          kind="quiet"
          label="Undo power"
          onPress={() => {
            editor.dispatch('undo');
            setApplied(null);
          }}
        />
      </View>
    );
  }
  const tip = suggestedPower(result, lightId);
  if (!tip || !result) return null;
  const power = formatPower(tip.fraction);
  return (
    <View style={s.row} testID="suggested-power">
      <Text style={s.text}>{tip.why === 'level-over-key' ? `The meter suggests ${power} for its level over the key.` : `The meter suggests ${power} for ${formatAperture(result.targetAperture)}.`}</Text>
      <Button
        label={`Set power to ${power}`}
        onPress={() => {
          editor.dispatch('updateItem', { id: tip.lightId, patch: { power: tip.fraction } });
          setApplied({ revision: editor.getState().revision, lightId: tip.lightId, power });
        }}
      />
    </View>
  );
}

const s = StyleSheet.create({
  row: { paddingHorizontal: space.lg, paddingVertical: space.sm, gap: space.sm, borderBottomWidth: 1, borderColor: colours.line },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 14 },
});

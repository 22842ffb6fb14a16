// Two frames side by side with one set of looks: a student's plan against the reference, so a review compares
// the pictures the two plans would make, not only their numbers.
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { FRAME_LIMITS } from '../../calc/frame/limits';
import { colours, fonts, space } from '../../constants/theme';
import type { SetupDocument } from '../../model/document';
import { FramePicture, type Look, Toggles } from './FrameView';

export function FramePair({ left, right, width, testID = 'frame-pair' }: { left: { title: string; doc: SetupDocument }; right: { title: string; doc: SetupDocument }; width: number; testID?: string }) {
  const [look, setLook] = useState<Look>({ mono: false, clipping: false, contours: false });
  const each = Math.max(120, Math.floor((width - space.sm) / 2));
  return (
    <View style={s.root} testID={testID}>
      <View style={s.pair}>
        {[left, right].map((p, k) => (
          <View key={k} style={{ width: each, gap: 4 }}>
            <Text style={s.title} numberOfLines={1}>
              {p.title}
            </Text>
            <FramePicture doc={p.doc} width={each} look={look} testID={`${testID}-${k === 0 ? 'left' : 'right'}`} />
          </View>
        ))}
      </View>
      <Toggles look={look} setLook={setLook} />
      <Text style={s.limits}>{FRAME_LIMITS}</Text>
    </View>
  );
}

const s = StyleSheet.create({
  root: { gap: space.sm },
  pair: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  title: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 12 },
  limits: { color: colours.textFaint, fontFamily: fonts.sans, fontSize: 11 },
});

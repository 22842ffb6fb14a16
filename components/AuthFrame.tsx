// The signed-out page: the mark, one line on what Falloff is for, and the form card.
import type { ReactNode } from 'react';
import { KeyboardAvoidingView, Platform, ScrollView, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../constants/theme';
import { Mark } from './Glyph';
import { Card, Title } from './ui';

export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <KeyboardAvoidingView style={{ flex: 1, backgroundColor: colours.graphite }} behavior={Platform.OS === 'ios' ? 'padding' : undefined}>
      <ScrollView contentContainerStyle={s.scroll} keyboardShouldPersistTaps="handled">
        <View style={s.column}>
          <View style={s.brand}>
            <Mark size={40} />
            <Text style={s.brandText}>Falloff</Text>
          </View>
          <Text style={s.pitch}>Plan the light, meter it before the shoot, hand the set to your crew.</Text>
          <Card>
            <Title>{title}</Title>
            {children}
          </Card>
        </View>
      </ScrollView>
    </KeyboardAvoidingView>
  );
}

const s = StyleSheet.create({
  scroll: { flexGrow: 1, justifyContent: 'center', padding: space.lg },
  column: { width: '100%', maxWidth: 420, alignSelf: 'center' },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.md, marginBottom: space.sm },
  brandText: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 30, letterSpacing: 0.5 },
  pitch: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 15, lineHeight: 22, marginBottom: space.xl },
});

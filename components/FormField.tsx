// A labelled text input bound to react-hook-form; the field's error (from the shared zod schema or the
// server) shows beside it.
import { useEffect, useRef } from 'react';
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { Platform, StyleSheet, Text, TextInput, View, type TextInputProps } from 'react-native';
import { colours, fonts, radius, space } from '../constants/theme';
import { ErrorText } from './ui';

export function FormField<T extends FieldValues>({
  control,
  name,
  label,
  error,
  ...input
}: { control: Control<T>; name: Path<T>; label: string; error?: string } & Omit<TextInputProps, 'value' | 'onChangeText'>) {
  return (
    <View style={s.wrap}>
      <Text style={s.label} nativeID={`${name}-label`}>
        {label}
      </Text>
      <Controller
        control={control}
        name={name}
        render={({ field }) => (
          <BoundInput
            {...input}
            accessibilityLabel={label}
            aria-labelledby={`${name}-label`}
            value={(field.value as string | undefined) ?? ''}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            placeholderTextColor={colours.textFaint}
            style={[s.input, error ? { borderColor: colours.danger } : null]}
          />
        )}
      />
      {error ? <ErrorText>{error}</ErrorText> : null}
    </View>
  );
}

/**
 * The input, keeping what was typed before the page hydrated: a signed-out page is rendered at build time
 * (scripts/staticPages.mjs) and its fields take keys before the scripts arrive; React keeps the field's text
 * when it hydrates but the form's value is still empty, so the form is told once the input is mounted.
 */
function BoundInput(props: TextInputProps & { value: string; onChangeText: (text: string) => void }) {
  const ref = useRef<TextInput>(null);
  const { value, onChangeText } = props;
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const typed = (ref.current as unknown as { value?: unknown } | null)?.value;
    if (typeof typed === 'string' && typed !== value) onChangeText(typed);
    // Once, as the field mounts: later keys reach the form through onChangeText.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  return <TextInput ref={ref} {...props} />;
}

const s = StyleSheet.create({
  wrap: { marginBottom: space.lg },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, marginBottom: space.xs, letterSpacing: 0.3 },
  input: {
    color: colours.text,
    fontFamily: fonts.sans,
    fontSize: 16,
    backgroundColor: colours.graphite,
    borderWidth: 1,
    borderColor: colours.line,
    borderRadius: radius.md,
    paddingHorizontal: space.md,
    paddingVertical: space.md,
    minHeight: 48,
  },
});

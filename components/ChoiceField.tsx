// One of a few choices (a studio, a role) bound to react-hook-form; the field's error shows beside it.
import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import { StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../constants/theme';
import { Chip } from './Chips';
import { ErrorText } from './ui';

export function ChoiceField<T extends FieldValues>({
  control,
  name,
  label,
  options,
  error,
}: {
  control: Control<T>;
  name: Path<T>;
  label: string;
  options: { value: string; label: string; hint?: string }[];
  error?: string;
}) {
  return (
    <View style={s.wrap} role="radiogroup" aria-label={label}>
      <Text style={s.label}>{label}</Text>
      <Controller
        control={control}
        name={name}
        render={({ field }) => (
          <View style={s.options}>
            {options.map((o) => (
              <Chip key={o.value} label={o.label} hint={o.hint} selected={field.value === o.value} onPress={() => field.onChange(o.value)} />
            ))}
          </View>
        )}
      />
      {error ? <ErrorText>{error}</ErrorText> : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { marginBottom: space.lg },
  label: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13, marginBottom: space.xs, letterSpacing: 0.3 },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

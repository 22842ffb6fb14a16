import { ActivityIndicator, View } from 'react-native';
import { colours } from '../constants/theme';

export function Loading() {
  return (
    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colours.graphite }}>
      <ActivityIndicator color={colours.accent} size="large" accessibilityLabel="Loading" />
    </View>
  );
}

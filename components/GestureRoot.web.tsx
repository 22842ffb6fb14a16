// On the web gesture handler needs no root view: a plain View keeps it out of the first download (see
// GestureRoot.tsx for the phones).
import type { ComponentProps } from 'react';
import { View } from 'react-native';

export function GestureRoot(props: ComponentProps<typeof View>) {
  return <View {...props} />;
}

// A short message at the bottom of a screen with one or two actions ("Undo"), gone after a few seconds.
import { useCallback, useEffect, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../constants/theme';

type ToastAction = { label: string; onPress: () => void };
export type ToastMessage = { text: string; actions?: ToastAction[] };

const TOAST_MS = 7000;

/** State for one toast at a time: show(message) replaces the current one. */
export function useToast() {
  const [message, setMessage] = useState<ToastMessage | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const hide = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    setMessage(null);
  }, []);
  const show = useCallback((m: ToastMessage) => {
    if (timer.current) clearTimeout(timer.current);
    setMessage(m);
    timer.current = setTimeout(() => setMessage(null), TOAST_MS);
  }, []);
  useEffect(() => () => void (timer.current && clearTimeout(timer.current)), []);
  return { message, show, hide };
}

export function Toast({ message, onDone }: { message: ToastMessage | null; onDone: () => void }) {
  if (!message) return null;
  return (
    <View style={s.wrap} pointerEvents="box-none">
      <View style={s.toast} accessibilityRole="alert" accessibilityLiveRegion="polite" testID="toast">
        <Text style={s.text}>{message.text}</Text>
        {message.actions?.map((a) => (
          <Pressable
            key={a.label}
            accessibilityRole="button"
            accessibilityLabel={a.label}
            onPress={() => {
              onDone();
              a.onPress();
            }}
            style={({ pressed }) => [s.action, pressed && { opacity: 0.7 }]}
          >
            <Text style={s.actionText}>{a.label}</Text>
          </Pressable>
        ))}
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { position: 'absolute', left: 0, right: 0, bottom: space.lg, alignItems: 'center', paddingHorizontal: space.lg },
  toast: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    backgroundColor: colours.panelRaised,
    borderColor: colours.line,
    borderWidth: 1,
    borderRadius: radius.md,
    paddingLeft: space.lg,
    paddingRight: space.sm,
    paddingVertical: space.sm,
    maxWidth: 560,
    width: '100%',
  },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 14, flex: 1 },
  action: { paddingHorizontal: space.md, minHeight: 40, justifyContent: 'center' },
  actionText: { color: colours.accent, fontFamily: fonts.sansBold, fontSize: 14 },
});

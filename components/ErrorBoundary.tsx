// When part of the app throws while rendering, that part shows a plain message with a way back instead of a
// blank page. Before the message shows, every open editor saves what is pending (flushAll), so "Try again"
// or leaving loses no work. Used at the root, around each route (Expo Router's `ErrorBoundary` export), around
// the editor and around each plan view.
import { Component, type ErrorInfo, type ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { flushAll } from '../canvas/editor/persist';
import { colours, fonts, space } from '../constants/theme';

type Props = {
  /** What failed, in the user's words ("the plan", "this page"). */
  what: string;
  children: ReactNode;
  /** Where "Leave" goes; without it only "Try again" is offered. */
  onLeave?: () => void;
  leaveLabel?: string;
  compact?: boolean;
  /** Told about the error (logging). */
  onError?: (error: Error, info: ErrorInfo) => void;
};

type State = { error: Error | null; saving: boolean };

export class ErrorBoundary extends Component<Props, State> {
  override state: State = { error: null, saving: false };

  static getDerivedStateFromError(error: Error): Partial<State> {
    return { error, saving: true };
  }

  override componentDidCatch(error: Error, info: ErrorInfo) {
    this.props.onError?.(error, info);
    if (typeof console !== 'undefined') console.error(`[falloff] ${this.props.what} failed:`, error);
    void flushAll().finally(() => this.setState({ saving: false }));
  }

  retry = () => this.setState({ error: null, saving: false });

  leave = () => {
    void flushAll().finally(() => this.props.onLeave?.());
  };

  override render() {
    const { error, saving } = this.state;
    if (!error) return this.props.children;
    return <ErrorPanel what={this.props.what} error={error} saving={saving} onRetry={this.retry} onLeave={this.props.onLeave ? this.leave : undefined} leaveLabel={this.props.leaveLabel} compact={this.props.compact} />;
  }
}

export function ErrorPanel({ what, error, saving, onRetry, onLeave, leaveLabel = 'Back to setups', compact }: { what: string; error: Error; saving?: boolean; onRetry: () => void; onLeave?: () => void; leaveLabel?: string; compact?: boolean }) {
  return (
    <View style={[s.wrap, compact && s.compact]} accessibilityRole="alert" testID="error-boundary">
      <Text style={s.title}>Something went wrong in {what}.</Text>
      <Text style={s.body}>{saving ? 'Saving your changes…' : 'Your changes are saved. Try again, or leave and come back.'}</Text>
      <Text style={s.detail} numberOfLines={3}>
        {error.message}
      </Text>
      <View style={s.row}>
        <Pressable accessibilityRole="button" accessibilityLabel="Try again" onPress={onRetry} style={s.button}>
          <Text style={s.buttonText}>Try again</Text>
        </Pressable>
        {onLeave ? (
          <Pressable accessibilityRole="button" accessibilityLabel={leaveLabel} onPress={onLeave} style={[s.button, s.quiet]}>
            <Text style={[s.buttonText, { color: colours.text }]}>{leaveLabel}</Text>
          </Pressable>
        ) : null}
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { flex: 1, padding: space.xl, gap: space.sm, backgroundColor: colours.graphite, justifyContent: 'center' },
  compact: { padding: space.md, minHeight: 160 },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17 },
  body: { color: colours.text, fontFamily: fonts.sans, fontSize: 14 },
  detail: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 12 },
  row: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', marginTop: space.sm },
  button: { minHeight: 44, paddingHorizontal: space.lg, borderRadius: 8, backgroundColor: colours.accent, alignItems: 'center', justifyContent: 'center' },
  quiet: { backgroundColor: 'transparent', borderWidth: 1, borderColor: colours.line },
  buttonText: { color: colours.accentText, fontFamily: fonts.sansMedium, fontSize: 14 },
});

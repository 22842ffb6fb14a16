// The crew sheet PDF and the plan images as downloads, with a progress bar while the server makes and sends
// them. `base` is the API path of the setup ("/api/setups/<id>" or "/api/shared/<token>").
import { useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { Button, ErrorText } from '../ui';
import { kb } from '../../model/format';
import { downloadWithProgress, type Progress } from './download';

type Kind = 'pdf' | 'png' | 'svg';
const what: Record<Kind, { label: string; path: string; busy: string }> = {
  pdf: { label: 'Crew sheet (PDF)', path: 'crew-sheet.pdf?download=1', busy: 'Making the crew sheet' },
  png: { label: 'Plan image (PNG)', path: 'plan.png?width=2000', busy: 'Drawing the plan' },
  svg: { label: 'Plan drawing (SVG)', path: 'plan.svg', busy: 'Writing the plan' },
};

export function ExportButtons({ base, fileStem, query = '' }: { base: string; fileStem: string; query?: string }) {
  const [busy, setBusy] = useState<Kind | null>(null);
  const [progress, setProgress] = useState<Progress | null>(null);
  const [error, setError] = useState<string | null>(null);
  const abort = useRef<AbortController | null>(null);

  const run = async (k: Kind) => {
    setError(null);
    setBusy(k);
    setProgress(null);
    abort.current = new AbortController();
    try {
      const sep = what[k].path.includes('?') ? '&' : '?';
      await downloadWithProgress(`${base}/${what[k].path}${k === 'pdf' && query ? `${sep}${query}` : ''}`, `${k === 'pdf' ? 'crew-sheet' : 'plan'}-${fileStem}.${k}`, setProgress, abort.current.signal);
    } catch (e) {
      if ((e as Error).name !== 'AbortError') setError(`Could not download: ${(e as Error).message}`);
    } finally {
      setBusy(null);
    }
  };

  const fraction = progress?.total ? progress.loaded / progress.total : null;
  return (
    <View style={s.wrap}>
      <View style={s.row}>
        {(['pdf', 'png', 'svg'] as Kind[]).map((k) => (
          <Button key={k} label={what[k].label} kind={k === 'pdf' ? 'primary' : 'quiet'} busy={busy === k} disabled={busy !== null && busy !== k} onPress={() => void run(k)} testID={`download-${k}`} />
        ))}
      </View>
      {busy ? (
        <View accessibilityRole="progressbar" accessibilityLabel={what[busy].busy} accessibilityValue={fraction !== null ? { min: 0, max: 100, now: Math.round(fraction * 100) } : undefined} testID="download-progress">
          <View style={s.track}>
            <View style={[s.bar, { width: fraction !== null ? `${Math.round(fraction * 100)}%` : '30%' }, fraction === null && { opacity: 0.5 }]} />
          </View>
          <Text style={s.note}>
            {what[busy].busy}
            {progress && progress.loaded > 0 ? ` · ${kb(progress.loaded)}${progress.total ? ` of ${kb(progress.total)}` : ''}` : '…'}
          </Text>
        </View>
      ) : null}
      {error ? <ErrorText>{error}</ErrorText> : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  track: { height: 6, borderRadius: radius.sm, backgroundColor: colours.panelRaised, overflow: 'hidden' },
  bar: { height: 6, backgroundColor: colours.accent },
  note: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 12, marginTop: 4 },
});

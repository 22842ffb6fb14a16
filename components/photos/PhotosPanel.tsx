// Reference and result photos beside the setup that made them, each with the camera settings its EXIF gave
// and, for results, how they compare with what the meter predicts at the subject.
import { useState } from 'react';
import { Image, Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useDeletePhoto, usePhotos, useUploadPhoto } from '../../hooks/photos';
import type { PhotoKind, SetupPhoto } from '../../model/api';
import { formatAperture, formatShutter } from '../../model/units';
import { Segmented } from '../Chips';
import { Body, ErrorText } from '../ui';
import { PhotoPicker } from './PhotoPicker';

/**
 * "The photo was shot at f/8; the plan predicts f/7.1 at the subject (0.3 stops narrower)." Apertures only:
 * the stops between two f-numbers are 2·log2(N1/N0).
 */
export function comparison(photoAperture: number | null, predicted: number | null): string | null {
  if (photoAperture === null || predicted === null) return null;
  const stops = 2 * Math.log2(photoAperture / predicted);
  const size = Math.abs(stops);
  const apart = size < 0.15 ? 'the same within a sixth of a stop' : `${size.toFixed(1)} stop${size.toFixed(1) === '1.0' ? '' : 's'} ${stops > 0 ? 'narrower' : 'wider'}`;
  return `The photo was shot at ${formatAperture(photoAperture)}; the plan predicts ${formatAperture(predicted)} at the subject (${apart}).`;
}

function settingsLine(p: SetupPhoto): string {
  const e = p.exif;
  const parts = [e.aperture !== null ? formatAperture(e.aperture) : null, e.shutterS !== null ? formatShutter(e.shutterS) : null, e.iso !== null ? `ISO ${Math.round(e.iso)}` : null, e.focalMm !== null ? `${Math.round(e.focalMm)} mm` : null].filter(Boolean);
  return parts.length ? parts.join(' · ') : 'no camera settings in the file';
}

export function PhotosPanel({ setupId, predictedAperture }: { setupId: string; predictedAperture: number | null }) {
  const photos = usePhotos(setupId);
  const upload = useUploadPhoto(setupId);
  const remove = useDeletePhoto(setupId);
  const [kind, setKind] = useState<PhotoKind>('result');
  return (
    <View style={s.wrap} accessibilityLabel="Photos">
      <Text style={s.heading}>Photos</Text>
      <Body dim style={s.small}>
        Reference photos of the set as rigged, and results from the shoot. Camera settings are read from each photo; locations are removed.
      </Body>
      <Segmented
        label="Kind of photo"
        value={kind}
        onChange={setKind}
        options={[
          { value: 'result', label: 'Result' },
          { value: 'reference', label: 'Reference' },
        ]}
      />
      <PhotoPicker label={kind === 'result' ? 'Attach a result photo' : 'Attach a reference photo'} busy={upload.isPending} onPick={(file) => upload.mutate({ file, kind })} />
      {upload.error ? <ErrorText>{upload.error.message}</ErrorText> : null}
      {remove.error ? <ErrorText>{remove.error.message}</ErrorText> : null}
      {photos.data?.length ? (
        photos.data.map((p) => (
          <View key={p.id} style={s.photo} testID="photo">
            {p.thumbnailUrl ? (
              <Image source={{ uri: p.thumbnailUrl }} style={[s.thumb, p.width && p.height ? { aspectRatio: p.width / p.height } : null]} resizeMode="cover" accessibilityLabel={`${p.kind} photo ${p.filename}`} />
            ) : (
              <View style={[s.thumb, s.noThumb]}>
                <Text style={s.noThumbText}>{p.mime.split('/')[1]?.toUpperCase()}</Text>
              </View>
            )}
            <View style={s.body}>
              <Text style={s.name} numberOfLines={1}>
                {p.kind === 'result' ? 'Result' : 'Reference'} · {p.filename}
              </Text>
              <Text style={s.settings} testID="photo-settings">
                {settingsLine(p)}
              </Text>
              {p.exif.camera ? <Text style={s.small}>{p.exif.camera}</Text> : null}
              {p.kind === 'result' && comparison(p.exif.aperture, predictedAperture) ? (
                <Text style={s.compare} testID="photo-comparison">
                  {comparison(p.exif.aperture, predictedAperture)}
                </Text>
              ) : null}
              {p.notes.map((n) => (
                <Text key={n} style={s.small}>
                  {n}
                </Text>
              ))}
              <View style={s.actions}>
                <Pressable accessibilityRole="link" accessibilityLabel={`Open ${p.filename}`} onPress={() => (typeof window !== 'undefined' ? window.open(p.url, '_blank') : undefined)}>
                  <Text style={s.action}>Open</Text>
                </Pressable>
                <Pressable accessibilityRole="button" accessibilityLabel={`Delete ${p.filename}`} onPress={() => remove.mutate(p.id)}>
                  <Text style={[s.action, { color: colours.danger }]}>Delete</Text>
                </Pressable>
              </View>
            </View>
          </View>
        ))
      ) : photos.isSuccess ? (
        <Body dim style={s.small}>
          No photos yet.
        </Body>
      ) : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { padding: space.lg, gap: space.md },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18 },
  small: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12, lineHeight: 17 },
  photo: { flexDirection: 'row', gap: space.md, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colours.line },
  thumb: { width: 112, aspectRatio: 1.5, borderRadius: radius.sm, backgroundColor: colours.panelRaised },
  noThumb: { alignItems: 'center', justifyContent: 'center' },
  noThumbText: { color: colours.textDim, fontFamily: fonts.monoMedium, fontSize: 12 },
  body: { flex: 1, gap: 3 },
  name: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  settings: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 14 },
  compare: { color: colours.cool, fontFamily: fonts.sans, fontSize: 13, lineHeight: 18 },
  actions: { flexDirection: 'row', gap: space.lg, marginTop: 4 },
  action: { color: colours.accent, fontFamily: fonts.sansMedium, fontSize: 13, paddingVertical: 6 },
});

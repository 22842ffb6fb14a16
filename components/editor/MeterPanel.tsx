import { memo } from 'react';
// The meter: what a handheld incident meter would read at the subject, per light and in total, with the
// ratios, background, ambient, sync and power advice. Every reading is text (never colour alone).
import { Pressable, StyleSheet, Text, View } from 'react-native';
import Svg, { Line, Path, Text as SvgText } from 'react-native-svg';
import { nice, ticks } from 'd3-array';
import { line } from 'd3-shape';
import { inverseSquareStops, type MeterResult } from '../../calc';
import type { Readings } from '../../canvas/useReadings';
import { colours, fonts, space } from '../../constants/theme';
import type { ItemOf, SetupDocument } from '../../model/document';
import { planCautions } from '../../model/safety';
import { formatAperture, formatLength, formatPower, formatShutter, formatStops, type Units } from '../../model/units';
import { keyFillDetail } from '../../model/format';
import { itemNames, warningText } from '../../model/kinds';

/** The receptors in plain words (what the exposure readings are by). */
export const RECEPTOR_WORDS: Record<MeterResult['receptor'], { label: string; hint: string }> = {
  'dome-camera': { label: 'Dome to camera', hint: 'a dome at the face pointed at the camera' },
  'flat-light': { label: 'Flat to each light', hint: 'a flat disc at the face pointed at each light in turn' },
  'flat-face': { label: 'Flat along the face', hint: 'a flat disc at the face, pointed where the face points' },
};

/** How each point of the light map is read, in the words of the meter the photographer would hold there. */
const MAP_RECEPTOR_WORDS: Record<'dome' | 'flat' | 'pointed', string> = {
  dome: 'read at each point by a dome pointed at the camera',
  flat: 'read at each point by a flat meter facing as the subject faces',
  pointed: 'read at each point by a flat meter pointed at each light in turn',
};

/** What the editor's meter shows before its first reading has come (the engine computes it off the render). */
export const METER_READING = 'Reading the plan…';

/** `readings` null: the meter is still reading the plan (the panel says so; the plan's safety cautions, which
 *  need no reading, show already). */
export const MeterPanel = memo(function MeterPanel({ readings, doc, selectedLight, units, onReceptorChange }: { readings: Readings | null; doc: SetupDocument; selectedLight: ItemOf<'light'> | null; units: Units; onReceptorChange?: (r: MeterResult['receptor']) => void }) {
  const m = readings?.meter;
  const cautions = planCautions(doc);
  const names = itemNames(doc.items);
  return (
    <View style={s.wrap} accessibilityLabel="Meter">
      <Text style={s.heading}>Meter</Text>
      {!readings ? (
        <Text style={s.dim} testID="meter-pending">
          {METER_READING}
        </Text>
      ) : null}
      {readings?.build.missing.length ? <Text style={s.dim}>Add {readings.build.missing.join(' and ')} to read the light.</Text> : null}
      {readings?.error ? <Text style={s.warn} accessibilityRole="alert">The meter cannot read this plan: {readings.error.split('\n')[1] ?? readings.error}</Text> : null}
      {m ? (
        <>
          <View style={s.block} accessibilityLabel="Receptor">
            <Text style={s.dim} testID="meter-receptor">
              Read by: {RECEPTOR_WORDS[m.receptor].hint}
            </Text>
            {onReceptorChange ? (
              <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: 6 }}>
                {(Object.keys(RECEPTOR_WORDS) as MeterResult['receptor'][]).map((r) => (
                  <Pressable key={r} accessibilityRole="radio" accessibilityState={{ checked: m.receptor === r }} aria-checked={m.receptor === r} accessibilityLabel={RECEPTOR_WORDS[r].label} onPress={() => m.receptor !== r && onReceptorChange(r)} style={[s.chip, m.receptor === r && s.chipOn]}>
                    <Text style={s.readingDetail}>{RECEPTOR_WORDS[r].label}</Text>
                  </Pressable>
                ))}
              </View>
            ) : null}
          </View>
          <Subject m={m} camera={readings.build.scene!.camera} assumedCamera={readings.build.assumedCamera} />
          {readings.map ? (
            <Text style={s.dim} testID="meter-map-caption">
              {readings.map.reference === 'subject'
                ? `Light map: stops vs the subject (${formatAperture(m.subject.aperture)}), at face height (${formatLength(readings.map.heightM, units)}), ${MAP_RECEPTOR_WORDS[readings.map.receptor]}; one line a stop.`
                : `Light map: stops vs the brightest point (no light on the subject), at face height (${formatLength(readings.map.heightM, units)}); one line a stop.`}
            </Text>
          ) : null}
          <Lights m={m} names={names} />
          <Ratios m={m} />
          {m.warnings.length ? (
            <View style={s.block}>
              {m.warnings.map((w, k) => (
                <Text key={k} style={s.warn} accessibilityRole="alert">
                  ⚠ {warningText(w, names)}
                </Text>
              ))}
            </View>
          ) : null}
          {selectedLight ? <FalloffChart m={m} light={selectedLight} units={units} /> : null}
        </>
      ) : null}
      {cautions.length ? (
        <View style={s.block}>
          <Text style={s.sub}>Safety</Text>
          {cautions.map((c) => (
            <Text key={c.code + (c.itemId ?? '')} style={s.caution}>
              ▲ {c.message}
            </Text>
          ))}
          <Text style={s.dim}>Follow local electrical and venue codes and licensed practice.</Text>
        </View>
      ) : null}
    </View>
  );
});

function Reading({ label, value, detail, testID }: { label: string; value: string; detail?: string; testID?: string }) {
  return (
    <View style={s.reading}>
      <Text style={s.readingLabel}>{label}</Text>
      <View style={{ alignItems: 'flex-end' }}>
        <Text style={s.readingValue} testID={testID}>
          {value}
        </Text>
        {detail ? <Text style={s.readingDetail}>{detail}</Text> : null}
      </View>
    </View>
  );
}

function Subject({ m, camera, assumedCamera }: { m: MeterResult; camera: { aperture: number; shutterS: number; iso: number }; assumedCamera: boolean }) {
  const c = m.camera;
  return (
    <View style={s.block}>
      <Reading label="At the subject" value={formatAperture(m.subject.aperture)} detail={`${formatStops(m.subject.stopsVsCamera)} stops vs the camera`} testID="meter-subject" />
      <Text style={s.dim}>
        {assumedCamera ? 'No camera drawn: assuming ' : 'Camera '}
        {formatAperture(camera.aperture)} · {formatShutter(camera.shutterS)} · ISO {camera.iso} · sync {formatShutter(c.syncSpeedS)}
      </Text>
      {m.ambient ? <Reading label="Room light" value={`${formatStops(m.ambient.stopsVsCamera)} stops`} detail={m.ambient.stopsVsCamera < 0 ? `${Math.abs(m.ambient.stopsVsCamera).toFixed(1)} stops under the exposure` : 'it will show in the picture'} testID="meter-ambient" /> : null}
      {c.overSync ? (
        <Text style={s.warn} accessibilityRole="alert">
          ⚠ The shutter is faster than the flash sync ({formatShutter(c.syncSpeedS)}): part of the frame will be dark.
        </Text>
      ) : null}
    </View>
  );
}

function Lights({ m, names }: { m: MeterResult; names: ReadonlyMap<string, string> }) {
  return (
    <View style={s.block}>
      <Text style={s.sub}>Each light alone</Text>
      {m.lights.map((l) => (
        <View key={l.id} style={s.light} accessibilityLabel={`${names.get(l.id)}: ${formatAperture(l.aperture)}`}>
          <View style={{ flex: 1 }}>
            <Text style={s.lightName}>
              {names.get(l.id)} {l.ratioRole !== 'none' ? `· ${l.ratioRole}` : ''}
            </Text>
            <Text style={s.readingDetail}>
              {l.enabled ? `${formatPower(l.powerFraction)} · ${l.distanceM.toFixed(2)} m${l.transmission < 1 ? ` · ${l.transmission === 0 ? 'blocked' : 'partly blocked'}` : ''}` : 'off'}
            </Text>
            {l.enabled && l.pointed.aperture !== null && m.receptor !== 'flat-light' ? (
              <Text style={s.readingDetail} testID={`meter-light-${l.id}-pointed`}>
                pointed at it: {formatAperture(l.pointed.aperture)}
              </Text>
            ) : null}
            {l.enabled && l.vsKey ? (
              <Text style={s.readingDetail} testID={`meter-light-${l.id}-vskey`}>
                {l.vsKey.stops !== null
                  ? `${formatStops(l.vsKey.stops)} vs the key (wanted ${formatStops(l.vsKey.targetStops)})`
                  : l.pointed.stopsVsCamera !== null
                    ? `no key: pointed at it, ${formatStops(l.pointed.stopsVsCamera)} vs the camera`
                    : 'no key to compare with'}
                {l.vsKey.fraction !== null && l.vsKey.stopsChange !== null && Math.abs(l.vsKey.stopsChange) >= 0.05
                  ? l.vsKey.beyondFull
                    ? ` — over full power by ${Math.log2(l.vsKey.fraction).toFixed(1)} stops`
                    : `: set ${formatPower(l.vsKey.fraction)}`
                  : ''}
              </Text>
            ) : null}
            {l.enabled && l.backgroundTone ? (
              <Text style={s.readingDetail} testID={`meter-light-${l.id}-tone`}>
                on the background: {toneWords(l.backgroundTone)}
              </Text>
            ) : null}
            {l.enabled && !l.vsKey && !l.backgroundTone && (l.role === 'auto' || l.role === 'key' || l.role === 'fill') && l.forTarget.fraction !== null ? (
              <Text style={s.readingDetail}>
                for {formatAperture(m.targetAperture)}: set {formatPower(l.forTarget.fraction)}
                {l.forTarget.beyondFull ? ` — over full power by ${Math.log2(l.forTarget.fraction).toFixed(1)} stops` : l.forTarget.belowMinimum ? ' — below its lowest setting' : ''}
              </Text>
            ) : null}
            {l.enabled && l.note ? <Text style={s.readingDetail}>{l.note}</Text> : null}
          </View>
          <View style={{ alignItems: 'flex-end' }}>
            <Text style={s.readingValue} testID={`meter-light-${l.id}`}>
              {formatAperture(l.aperture)}
            </Text>
            <Text style={s.readingDetail} testID={`meter-light-${l.id}-stops`}>
              {formatStops(l.stopsVsCamera)}
            </Text>
          </View>
        </View>
      ))}
    </View>
  );
}

function Ratios({ m }: { m: MeterResult }) {
  const kf = m.keyFill;
  const bg = m.background;
  return (
    <View style={s.block}>
      <Reading label="Key : fill" value={kf.ratio !== null ? `${kf.ratio.toFixed(1)}:1` : '—'} detail={keyFillDetail(kf)} testID="meter-keyfill" />
      <Reading label="Background" value={bg?.stopsVsSubject != null ? `${formatStops(bg.stopsVsSubject)} stops` : '—'} detail={bg ? 'light behind the subject, vs the subject' : 'no surface behind the subject'} testID="meter-background" />
      {bg ? (
        <View style={s.reading}>
          <Text style={s.readingLabel}>Background in the frame</Text>
          {/* Shrinks and wraps beside its label: three channels' stops overran a phone's width. */}
          <View style={{ alignItems: 'flex-end', flexShrink: 1, marginLeft: space.sm }}>
            <View style={{ flexDirection: 'row', alignItems: 'center', gap: 6, flexShrink: 1 }}>
              {bg.recorded.hex ? <View style={[s.swatch, { backgroundColor: bg.recorded.hex }]} /> : null}
              <Text style={[s.readingValue, { flexShrink: 1, textAlign: 'right' }]} testID="meter-background-recorded">
                {toneWords(bg.recorded)}
              </Text>
            </View>
            {bg.range ? (
              <Text style={[s.readingDetail, { textAlign: 'right' }]} testID="meter-background-range">
                across the frame: {toneWords(bg.range.darkest)} to {toneWords(bg.range.brightest)}
              </Text>
            ) : null}
            <Text style={[s.readingDetail, { textAlign: 'right' }]}>R G B vs a correctly exposed mid-grey</Text>
          </View>
        </View>
      ) : null}
      {m.subject.colour ? (
        <View style={s.reading}>
          <Text style={s.readingLabel}>Colour on the subject</Text>
          <View style={{ flexDirection: 'row', alignItems: 'center', gap: 6 }}>
            <View style={[s.swatch, { backgroundColor: m.subject.colour.hex }]} />
            <Text style={s.readingValue}>{m.subject.colour.cctK ? `${Math.round(m.subject.colour.cctK / 50) * 50} K` : m.subject.colour.hex}</Text>
          </View>
        </View>
      ) : null}
    </View>
  );
}

/** A recorded tone as R/G/B stops vs mid-grey, with clip and blocked-up words. */
function toneWords(t: { stops: (number | null)[]; clipped: boolean; blocked: boolean }): string {
  const v = t.stops.map((x) => (x === null ? '—' : formatStops(x))).join(' / ');
  return `${v}${t.clipped ? ' (clips)' : t.blocked ? ' (black)' : ''}`;
}

/** A linear map from `domain` to `range` (the chart's axes; d3-array gives their round ends and ticks). */
function linear(domain: [number, number], range: [number, number]) {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  return Object.assign((v: number) => (k === 0 ? (r0 + r1) / 2 : r0 + (v - d0) * k), { domain });
}

/** Stops at the subject against the selected light's distance: the inverse-square curve, with where it stands. */
function FalloffChart({ m, light, units }: { m: MeterResult; light: ItemOf<'light'>; units: Units }) {
  const reading = m.lights.find((l) => l.id === light.id);
  if (!reading || reading.stopsVsCamera === null) return null;
  const d0 = reading.distanceM;
  const w = 260;
  const h = 120;
  const pad = { l: 34, r: 8, t: 8, b: 22 };
  const maxD = Math.max(4, d0 * 2);
  const x = linear([0.5, maxD], [pad.l, w - pad.r]);
  const stopsAt = (d: number) => reading.stopsVsCamera! + inverseSquareStops(d0, d);
  const ys = [stopsAt(0.5), stopsAt(maxD)];
  const y = linear(nice(Math.min(...ys), Math.max(...ys), 10), [h - pad.b, pad.t]);
  const pts: [number, number][] = Array.from({ length: 40 }, (_, k) => {
    const d = 0.5 + ((maxD - 0.5) * k) / 39;
    return [x(d), y(stopsAt(d))];
  });
  const path = line()(pts) ?? '';
  return (
    <View style={s.block} accessibilityLabel={`Falloff of ${light.label || 'the light'}: ${formatStops(inverseSquareStops(d0, d0 * 2))} stops at twice the distance`}>
      <Text style={s.sub}>Falloff of {light.label || 'this light'}</Text>
      <Svg width={w} height={h}>
        <Line x1={pad.l} y1={y(0)} x2={w - pad.r} y2={y(0)} stroke={colours.textFaint} strokeDasharray="3,3" />
        <Path d={path} stroke={colours.accent} strokeWidth={2} fill="none" />
        <Line x1={x(d0)} y1={pad.t} x2={x(d0)} y2={h - pad.b} stroke={colours.cool} />
        {ticks(...y.domain, 4).map((t) => (
          <SvgText key={t} x={pad.l - 4} y={y(t) + 4} fontSize={10} fill={colours.textDim} textAnchor="end" fontFamily={fonts.mono}>
            {formatStops(t)}
          </SvgText>
        ))}
        {ticks(...x.domain, 4).map((t) => (
          <SvgText key={t} x={x(t)} y={h - 6} fontSize={10} fill={colours.textDim} textAnchor="middle" fontFamily={fonts.mono}>
            {formatLength(t, units, 1)}
          </SvgText>
        ))}
      </Svg>
      <Text style={s.readingDetail}>stops vs the camera against the light's distance; the dashed line is a correct exposure</Text>
    </View>
  );
}

const s = StyleSheet.create({
  chip: { paddingHorizontal: 10, minHeight: 44, justifyContent: 'center', borderRadius: 10, borderWidth: 1, borderColor: colours.line },
  chipOn: { backgroundColor: colours.panelRaised, borderColor: colours.accent },
  wrap: { padding: space.lg, gap: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18 },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, marginBottom: space.xs },
  block: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm, gap: 4 },
  reading: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', paddingVertical: 2 },
  readingLabel: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13 },
  readingValue: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 18 },
  readingDetail: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 11 },
  light: { flexDirection: 'row', gap: space.sm, paddingVertical: 4 },
  lightName: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12 },
  warn: { color: colours.danger, fontFamily: fonts.sans, fontSize: 13 },
  caution: { color: '#f2c46d', fontFamily: fonts.sans, fontSize: 12, lineHeight: 17 },
  swatch: { width: 16, height: 16, borderRadius: 8, borderWidth: 1, borderColor: '#0008' },
});

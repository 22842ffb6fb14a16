// The side view: the room cut along the camera's line to the subject (or a chosen light's), drawn from the
// side: floor, ceiling, walls crossed, the subject, the camera with its vertical field of view, each light at
// its height with its beam at its tilt. Drag a head up or down to change its height, its round handle to
// change its tilt; both go through the editor, so Undo takes them back.
import { useMemo, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { useEditor, useEditorApi, useEditorLate } from '../../canvas/editor/react';
import { itemNames } from '../../model/kinds';
import { shownItems } from '../../canvas/editor/state';
import { colours, fonts, space } from '../../constants/theme';
import { graphiteTheme } from '../../drawing/theme';
import type { ItemOf } from '../../model/document';
import type { Units } from '../../model/units';
import { beamEdges, sideScene, sideTransform, tiltHandle, type SideBox, type SidePoint, type SideScene, type SideShape } from './elevation';
import { createSideDrag } from './sideDrag';
import { SIDE_LABEL_PX, sideLabels } from './sideLabels';

const ink = graphiteTheme.ink;
const dim = graphiteTheme.inkDim;
const sel = graphiteTheme.selection;

export function SideView({ units, height = 260 }: { units: Units; height?: number }) {
  const editor = useEditorApi();
  // A plan drag's release shows here after the plan's own frame (its own lifts follow at once).
  const doc = useEditorLate((s) => s.doc);
  const visible = useEditor((s) => s.visibleIds);
  const selection = useEditor((s) => s.selection);
  const [refId, setRefId] = useState<string | null>(null);
  const [box, setBox] = useState<SideBox>({ w: 0, h: height });
  const shown = useMemo(() => shownItems({ doc, visibleIds: visible } as Parameters<typeof shownItems>[0]), [doc, visible]);
  const live = useMemo(() => sideScene(doc, refId, shown), [doc, refId, shown]);
  const drag = useRef(createSideDrag()).current;
  // The frame (metres shown) holds still while a drag is under way, so the head stays under the finger.
  const frozen = useRef<Pick<SideScene, 'u0' | 'u1' | 'z1'> | null>(null);
  const scene = live && frozen.current ? { ...live, ...frozen.current } : live;
  const names = itemNames(doc.items);
  const lines = doc.items.filter((i): i is ItemOf<'camera'> | ItemOf<'light'> => i.kind === 'camera' || i.kind === 'light');

  const onLayout = (e: LayoutChangeEvent) => setBox({ w: e.nativeEvent.layout.width, h: e.nativeEvent.layout.height });
  const xy = (e: GestureResponderEvent) => ({ x: e.nativeEvent.locationX, y: e.nativeEvent.locationY });
  const start = (e: GestureResponderEvent) => {
    if (!scene) return false;
    const { x, y } = xy(e);
    const took = drag.down(editor, scene, box, x, y);
    if (took) frozen.current = { u0: scene.u0, u1: scene.u1, z1: scene.z1 };
    return took;
  };
  const move = (e: GestureResponderEvent) => {
    if (!scene) return;
    const { x, y } = xy(e);
    drag.move(editor, scene, box, x, y);
  };
  const end = () => {
    drag.up(editor);
    frozen.current = null;
  };

  return (
    <View style={s.wrap} accessibilityLabel="Side view">
      <View style={s.head}>
        <Text style={s.title} role="heading" aria-level={2}>
          Side view
        </Text>
        <Text style={s.hint}>Drag a head to raise it, its ring to tilt it.</Text>
      </View>
      <View
        style={[s.canvas, { height }]}
        onLayout={onLayout}
        testID="side-view"
        onStartShouldSetResponder={start}
        onMoveShouldSetResponder={() => false}
        onResponderTerminationRequest={() => false}
        onResponderMove={move}
        onResponderRelease={end}
        onResponderTerminate={end}
      >
        {!scene ? (
          <Text style={[s.hint, { padding: space.lg }]}>Add a subject and a camera to see the setup from the side.</Text>
        ) : box.w > 0 ? (
          <SideDrawing scene={scene} box={box} selection={selection} units={units} />
        ) : null}
      </View>
      {/* Below the drawing: on a phone's half-height sheet the drawing shows first. */}
      {lines.length > 1 ? (
        <View style={s.chips} accessibilityLabel="Cut along">
          {lines.map((i) => {
            const on = (scene?.line.fromId ?? null) === i.id;
            return (
              <Pressable key={i.id} accessibilityRole="radio" accessibilityState={{ checked: on }} aria-checked={on} accessibilityLabel={`Along ${names.get(i.id) ?? ''}`} onPress={() => setRefId(i.id)} style={[s.chip, on && s.chipOn]}>
                <Text style={[s.chipText, on && { color: colours.accent }]}>{names.get(i.id)}</Text>
              </Pressable>
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

function SideDrawing({ scene, box, selection, units }: { scene: SideScene; box: SideBox; selection: string[]; units: Units }) {
  const t = sideTransform(scene, box);
  const P = (p: SidePoint) => t.toPx(p);
  const floorL = P({ u: scene.u0, z: 0 });
  const floorR = P({ u: scene.u1, z: 0 });
  const ticks: number[] = [];
  for (let z = 0.5; z < scene.z1; z += 0.5) ticks.push(z);
  const labels = sideLabels(scene, box, units, selection);
  return (
    <Svg width={box.w} height={box.h}>
      {ticks.map((z) => {
        const a = P({ u: scene.u0, z });
        return (
          <G key={z}>
            <Line x1={a.x} y1={a.y} x2={floorR.x} y2={a.y} stroke={graphiteTheme.gridMajor} strokeWidth={1} />
          </G>
        );
      })}
      <Line x1={floorL.x} y1={floorL.y} x2={floorR.x} y2={floorR.y} stroke={ink} strokeWidth={2} />
      {scene.ceiling !== null && scene.ceiling <= scene.z1 ? (
        <G testID="side-ceiling">
          <Line x1={floorL.x} y1={P({ u: 0, z: scene.ceiling }).y} x2={floorR.x} y2={P({ u: 0, z: scene.ceiling }).y} stroke={ink} strokeWidth={2} strokeDasharray="8,4" />
        </G>
      ) : null}
      {scene.shapes.map((sh) => (
        <Shape key={sh.id} sh={sh} P={P} scale={t.scale} selected={selection.includes(sh.id)} ceiling={scene.ceiling} />
      ))}
      <G testID="side-labels">
        {labels.map((l) => (
          <SvgText key={l.id} x={l.box.cx} y={l.box.cy + SIDE_LABEL_PX * 0.35} fontSize={SIDE_LABEL_PX} fill={l.role === 'scale' ? dim : ink} textAnchor="middle" fontFamily={l.mono ? fonts.mono : fonts.sansMedium} testID={`side-label-${l.id}`}>
            {l.text}
          </SvgText>
        ))}
      </G>
    </Svg>
  );
}

function Shape({ sh, P, scale, selected, ceiling }: { sh: SideShape; P: (p: SidePoint) => { x: number; y: number }; scale: number; selected: boolean; ceiling: number | null }) {
  const opacity = 'faint' in sh && sh.faint ? 0.4 : 1;
  const stroke = selected ? sel : ink;
  switch (sh.kind) {
    case 'wall': {
      const a = P({ u: sh.u, z: 0 });
      const b = P({ u: sh.u, z: ceiling !== null ? Math.min(sh.top, ceiling) : sh.top });
      return <Line x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={dim} strokeWidth={5} />;
    }
    case 'panel': {
      const a = P(sh.bottom);
      const b = P(sh.top);
      return <Line x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={dim} strokeWidth={4} opacity={opacity} />;
    }
    case 'subject': {
      const face = P(sh.at);
      const foot = P({ u: sh.at.u, z: 0 });
      const r = Math.max(5, 0.11 * scale);
      return (
        <G opacity={opacity} testID={`side-${sh.id}`}>
          <Path d={`M${face.x},${face.y + r} L${foot.x},${foot.y}`} stroke={graphiteTheme.subject} strokeWidth={Math.max(6, 0.3 * scale)} strokeLinecap="round" opacity={0.5} />
          <Circle cx={face.x} cy={face.y} r={r} fill={graphiteTheme.subject} stroke={selected ? sel : 'none'} strokeWidth={2} />
        </G>
      );
    }
    case 'camera': {
      const c = P(sh.at);
      const reach = 1.6;
      const ray = (deg: number) => P({ u: sh.at.u + sh.facing * Math.cos((deg * Math.PI) / 180) * reach, z: sh.at.z + Math.sin((deg * Math.PI) / 180) * reach });
      const up = ray(sh.tiltDeg + sh.halfFovDeg);
      const down = ray(sh.tiltDeg - sh.halfFovDeg);
      const hnd = P(tiltHandle(sh.at, sh.tiltDeg, sh.facing));
      const foot = P({ u: sh.at.u, z: 0 });
      return (
        <G opacity={opacity} testID={`side-${sh.id}`}>
          <Line x1={c.x} y1={c.y} x2={foot.x} y2={foot.y} stroke={dim} strokeWidth={2} />
          <Path d={`M${c.x},${c.y} L${up.x},${up.y} M${c.x},${c.y} L${down.x},${down.y}`} stroke={graphiteTheme.camera} strokeWidth={1} strokeDasharray="5,4" />
          <Rect x={c.x - 9} y={c.y - 7} width={18} height={14} rx={3} fill={graphiteTheme.camera} stroke={selected ? sel : 'none'} strokeWidth={2} />
          <Line x1={c.x} y1={c.y} x2={hnd.x} y2={hnd.y} stroke={stroke} strokeWidth={1.5} />
          <Circle cx={hnd.x} cy={hnd.y} r={7} fill="none" stroke={stroke} strokeWidth={2} />
        </G>
      );
    }
    case 'light': {
      const c = P(sh.at);
      const [a, b] = beamEdges(sh, ceiling).map(P) as [{ x: number; y: number }, { x: number; y: number }];
      const hnd = P(tiltHandle(sh.at, sh.tiltDeg, sh.facing));
      const foot = P({ u: sh.at.u, z: 0 });
      const tint = sh.tint;
      return (
        <G opacity={sh.on ? opacity : opacity * 0.5} testID={`side-${sh.id}`}>
          {sh.on ? <Path d={`M${c.x},${c.y} L${a.x},${a.y} L${b.x},${b.y} Z`} fill={sh.beam} fillOpacity={0.16} testID={`side-beam-${sh.id}`} /> : null}
          <Line x1={c.x} y1={c.y} x2={foot.x} y2={foot.y} stroke={dim} strokeWidth={2} />
          <Circle cx={c.x} cy={c.y} r={8} fill={graphiteTheme.background} stroke={selected ? sel : tint} strokeWidth={2.5} />
          <Line x1={c.x} y1={c.y} x2={hnd.x} y2={hnd.y} stroke={stroke} strokeWidth={1.5} />
          <Circle cx={hnd.x} cy={hnd.y} r={7} fill="none" stroke={stroke} strokeWidth={2} />
        </G>
      );
    }
  }
}

const s = StyleSheet.create({
  wrap: { paddingVertical: space.sm },
  head: { paddingHorizontal: space.lg, gap: 2 },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 16 },
  hint: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13 },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: 6, paddingHorizontal: space.lg, paddingTop: space.sm },
  chip: { minHeight: 44, paddingHorizontal: space.md, borderRadius: 22, borderWidth: 1, borderColor: colours.line, justifyContent: 'center' },
  chipOn: { borderColor: colours.accent },
  chipText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 13 },
  canvas: { marginTop: space.sm, backgroundColor: graphiteTheme.background, overflow: 'hidden' },
});

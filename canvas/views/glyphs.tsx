// Falloff's own plan glyphs, drawn from geometry. Each view draws one item in plan metres around its own
// origin (the canvas places and rotates it), so the same views serve the editor and the crew sheet.
import { memo, type ReactElement } from 'react';
import { Circle, Ellipse, G, Line, Path, Polygon, Rect, Text as SvgText } from 'react-native-svg';
import { GELS, MODIFIERS } from '../../calc';
import type { Item, ItemOf } from '../../model/document';
import { sensorFormats } from '../../model/items/camera';
import { SHAPER_SURFACES, panelEnds } from '../../model/scene';
import { formatLength, type Units } from '../../model/units';
import { LABEL_SIZE, STROKE, THIN, type PlanTheme } from './style';

export type ViewProps<T extends Item> = { item: T; theme: PlanTheme; units: Units; selected: boolean };

const deg = (r: number) => (r * 180) / Math.PI;
const rad = (d: number) => (d * Math.PI) / 180;

function Label({ text, y, theme }: { text: string; y: number; theme: PlanTheme }) {
  if (!text) return null;
  return (
    <SvgText x={0} y={y} fontSize={LABEL_SIZE} fill={theme.label} textAnchor="middle" fontFamily="IBMPlexSans_500Medium">
      {text}
    </SvgText>
  );
}

/** A subject seen from above: shoulders, head, and a nose mark showing where the face points. */
export const SubjectView = memo(function SubjectView({ item, theme }: ViewProps<ItemOf<'subject'>>) {
  return (
    <G x={item.x} y={item.y}>
      <G rotation={item.facingDeg}>
        <Ellipse cx={0} cy={0} rx={0.12} ry={0.25} fill={theme.subject} opacity={0.35} stroke={theme.subject} strokeWidth={STROKE} />
        <Circle cx={0.02} cy={0} r={0.11} fill={theme.subject} />
        <Polygon points="0.12,-0.05 0.2,0 0.12,0.05" fill={theme.subject} />
      </G>
      <Label text={item.label} y={0.45} theme={theme} />
    </G>
  );
});

const propShapes: Record<ItemOf<'prop'>['shape'], (c: string) => ReactElement> = {
  stool: (c) => <Circle r={0.17} fill="none" stroke={c} strokeWidth={STROKE} />,
  chair: (c) => (
    <>
      <Rect x={-0.22} y={-0.22} width={0.44} height={0.44} rx={0.05} fill="none" stroke={c} strokeWidth={STROKE} />
      <Line x1={-0.22} y1={-0.22} x2={-0.22} y2={0.22} stroke={c} strokeWidth={STROKE * 3} />
    </>
  ),
  'apple-box': (c) => (
    <>
      <Rect x={-0.25} y={-0.15} width={0.5} height={0.3} fill="none" stroke={c} strokeWidth={STROKE} />
      <Line x1={-0.1} y1={0} x2={0.1} y2={0} stroke={c} strokeWidth={STROKE} />
    </>
  ),
  table: (c) => <Rect x={-0.6} y={-0.4} width={1.2} height={0.8} rx={0.04} fill="none" stroke={c} strokeWidth={STROKE} />,
};

export const PropView = memo(function PropView({ item, theme }: ViewProps<ItemOf<'prop'>>) {
  return (
    <G x={item.x} y={item.y}>
      <G rotation={item.rotationDeg}>{propShapes[item.shape](theme.inkDim)}</G>
      <Label text={item.label} y={0.45} theme={theme} />
    </G>
  );
});

/** The camera: a body, a lens pointing along its aim, and its horizontal field of view as a wedge. */
export const CameraView = memo(function CameraView({ item, theme }: ViewProps<ItemOf<'camera'>>) {
  const half = Math.atan(sensorFormats[item.sensor].widthMm / (2 * item.focalMm));
  const reach = 4;
  const ex = Math.cos(half) * reach;
  const ey = Math.sin(half) * reach;
  return (
    <G x={item.x} y={item.y}>
      <G rotation={item.aimDeg}>
        <Path d={`M0,0 L${ex},${-ey} A${reach},${reach} 0 0 1 ${ex},${ey} Z`} fill={theme.camera} opacity={0.07} />
        <Line x1={0} y1={0} x2={ex} y2={-ey} stroke={theme.camera} strokeWidth={THIN} strokeDasharray="0.08,0.06" />
        <Line x1={0} y1={0} x2={ex} y2={ey} stroke={theme.camera} strokeWidth={THIN} strokeDasharray="0.08,0.06" />
        <Rect x={-0.16} y={-0.13} width={0.22} height={0.26} rx={0.03} fill={theme.camera} />
        <Rect x={0.06} y={-0.07} width={0.12} height={0.14} fill={theme.camera} opacity={0.8} />
      </G>
      <Label text={item.label || `${item.focalMm} mm`} y={0.42} theme={theme} />
    </G>
  );
});

/** The modifier's face, drawn ahead of the head along the aim (x axis), to scale where it has a size. */
function ModifierFace({ light, colour }: { light: ItemOf<'light'>; colour: string }) {
  const spec = MODIFIERS[light.modifier];
  const w = Math.max(0.18, spec.faceRadiusM * 2);
  const common = { stroke: colour, strokeWidth: STROKE, fill: 'none' } as const;
  switch (light.modifier) {
    case 'softbox':
    case 'diffusion':
      return <Path d={`M0.1,-0.08 L0.35,${-w / 2} L0.35,${w / 2} L0.1,0.08`} {...common} />;
    case 'strip':
      return <Path d={`M0.1,-0.06 L0.3,-0.15 L0.3,0.15 L0.1,0.06`} {...common} strokeWidth={STROKE * 1.5} />;
    case 'octa': {
      const r = w / 2;
      const pts = Array.from({ length: 8 }, (_, k) => {
        const a = rad(22.5 + k * 45);
        return `${0.35 + Math.cos(a) * 0.08},${Math.sin(a) * r}`;
      }).join(' ');
      return (
        <>
          <Line x1={0.1} y1={0} x2={0.3} y2={0} stroke={colour} strokeWidth={STROKE} />
          <Polygon points={pts} {...common} />
        </>
      );
    }
    case 'beauty-dish':
      return <Path d={`M0.28,${-w / 2} Q0.05,0 0.28,${w / 2}`} {...common} strokeWidth={STROKE * 1.5} />;
    case 'umbrella-reflective':
      return <Path d={`M0.1,0 M-0.15,${-w / 2} Q0.15,0 -0.15,${w / 2}`} {...common} />;
    case 'umbrella-shoot-through':
      return <Path d={`M0.45,${-w / 2} Q0.15,0 0.45,${w / 2}`} {...common} strokeDasharray="0.05,0.03" />;
    case 'snoot':
      return <Path d="M0.1,-0.06 L0.32,-0.03 L0.32,0.03 L0.1,0.06" {...common} />;
    case 'barn-doors':
      return (
        <>
          <Line x1={0.12} y1={-0.09} x2={0.26} y2={-0.2} stroke={colour} strokeWidth={STROKE} />
          <Line x1={0.12} y1={0.09} x2={0.26} y2={0.2} stroke={colour} strokeWidth={STROKE} />
        </>
      );
    case 'grid-10':
    case 'grid-20':
    case 'grid-30':
    case 'grid-40':
      return (
        <>
          <Rect x={0.12} y={-0.09} width={0.08} height={0.18} {...common} />
          <Line x1={0.16} y1={-0.09} x2={0.16} y2={0.09} stroke={colour} strokeWidth={THIN} />
        </>
      );
    default:
      return <Path d="M0.1,-0.09 L0.2,-0.13 L0.2,0.13 L0.1,0.09" {...common} />;
  }
}

/** A light seen from above: a disc for the head (a square for a continuous lamp) and its modifier's face. */
export const LightView = memo(function LightView({ item, theme }: ViewProps<ItemOf<'light'>>) {
  const tint = item.gel === 'none' ? theme.light : GELS[item.gel].tint;
  const off = !item.on;
  return (
    <G x={item.x} y={item.y} opacity={off ? 0.4 : 1}>
      <G rotation={item.aimDeg}>
        {item.source.type === 'continuous' ? (
          <Rect x={-0.12} y={-0.12} width={0.24} height={0.24} rx={0.03} fill={theme.background} stroke={tint} strokeWidth={STROKE * 1.5} />
        ) : (
          <Circle r={0.12} fill={theme.background} stroke={tint} strokeWidth={STROKE * 1.5} />
        )}
        <Circle r={0.045} fill={tint} />
        <ModifierFace light={item} colour={tint} />
        {item.gridDeg !== null ? <Line x1={0.33} y1={-0.12} x2={0.33} y2={0.12} stroke={tint} strokeWidth={THIN} strokeDasharray="0.02,0.02" /> : null}
      </G>
      <Label text={item.label} y={0.5} theme={theme} />
    </G>
  );
});

/** Reflectors, flags, v-flats and scrims are upright panels: drawn as their edge seen from above. */
export const PanelView = memo(function PanelView({ item, theme }: ViewProps<ItemOf<'reflector'> | ItemOf<'flag'> | ItemOf<'vflat'> | ItemOf<'scrim'>>) {
  const { a, b } = panelEnds(item);
  const n = { x: Math.cos(rad(item.rotationDeg)), y: Math.sin(rad(item.rotationDeg)) };
  const face = 0.06;
  let body: ReactElement;
  if (item.kind === 'reflector') {
    const c = SHAPER_SURFACES[item.finish].colour;
    body = (
      <>
        <Line x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={c} strokeWidth={0.06} strokeLinecap="round" />
        <Path d={`M${a.x + n.x * face},${a.y + n.y * face} Q${item.x + n.x * 0.2},${item.y + n.y * 0.2} ${b.x + n.x * face},${b.y + n.y * face}`} stroke={c} strokeWidth={THIN} fill="none" />
      </>
    );
  } else if (item.kind === 'flag') {
    body = <Line x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={theme.flag} strokeWidth={0.08} strokeLinecap="square" />;
  } else if (item.kind === 'vflat') {
    // Two boards hinged in a shallow V that opens towards the working face.
    const white = SHAPER_SURFACES.white.colour;
    const black = SHAPER_SURFACES.black.colour;
    const [front, back] = item.face === 'white' ? [white, black] : [black, white];
    const hinge = { x: item.x - n.x * 0.15, y: item.y - n.y * 0.15 };
    body = (
      <>
        <Path d={`M${a.x},${a.y} L${hinge.x},${hinge.y} L${b.x},${b.y}`} stroke={back} strokeWidth={0.07} fill="none" strokeLinejoin="round" />
        <Path d={`M${a.x + n.x * 0.04},${a.y + n.y * 0.04} L${hinge.x + n.x * 0.04},${hinge.y + n.y * 0.04} L${b.x + n.x * 0.04},${b.y + n.y * 0.04}`} stroke={front} strokeWidth={0.025} fill="none" />
      </>
    );
  } else {
    body = (
      <>
        <Line x1={a.x} y1={a.y} x2={b.x} y2={b.y} stroke={theme.ink} strokeWidth={0.05} strokeDasharray="0.06,0.04" opacity={0.7} />
      </>
    );
  }
  return (
    <G>
      {body}
      <G x={item.x - n.x * 0.35} y={item.y - n.y * 0.35}>
        <Label text={item.label} y={0.06} theme={theme} />
      </G>
    </G>
  );
});

export const WallView = memo(function WallView({ item, theme }: ViewProps<ItemOf<'wall'>>) {
  const len = Math.hypot(item.b.x - item.a.x, item.b.y - item.a.y);
  const ang = deg(Math.atan2(item.b.y - item.a.y, item.b.x - item.a.x));
  return (
    <G>
      <Line x1={item.a.x} y1={item.a.y} x2={item.b.x} y2={item.b.y} stroke={item.colour} strokeWidth={item.surface === 'seamless' ? 0.1 : 0.14} strokeLinecap="square" />
      {item.surface === 'seamless' ? (
        <Line x1={item.a.x} y1={item.a.y} x2={item.b.x} y2={item.b.y} stroke={theme.inkDim} strokeWidth={THIN} strokeDasharray="0.1,0.08" />
      ) : null}
      <G x={(item.a.x + item.b.x) / 2} y={(item.a.y + item.b.y) / 2} rotation={ang > 90 || ang < -90 ? ang + 180 : ang}>
        <Label text={item.label || (len > 0.5 ? `${len.toFixed(1)} m` : '')} y={-0.14} theme={theme} />
      </G>
    </G>
  );
});

export const NoteView = memo(function NoteView({ item, theme }: ViewProps<ItemOf<'note'>>) {
  return (
    <G x={item.x} y={item.y}>
      <Rect x={-0.05} y={-0.05} width={0.1} height={0.1} fill={theme.selection} />
      <SvgText x={0.12} y={0.05} fontSize={LABEL_SIZE} fill={theme.ink} fontFamily="IBMPlexSans_400Regular">
        {item.text}
      </SvgText>
    </G>
  );
});

/** A distance tape: the measured length between its ends, in the user's units. */
export const TapeView = memo(function TapeView({ item, theme, units }: ViewProps<ItemOf<'tape'>>) {
  const len = Math.hypot(item.b.x - item.a.x, item.b.y - item.a.y);
  const ang = deg(Math.atan2(item.b.y - item.a.y, item.b.x - item.a.x));
  const upright = ang > 90 || ang < -90 ? ang + 180 : ang;
  return (
    <G>
      <G x={item.a.x} y={item.a.y} rotation={ang}>
        <Line x1={0} y1={0} x2={len} y2={0} stroke={theme.inkDim} strokeWidth={THIN} />
        <Line x1={0} y1={-0.08} x2={0} y2={0.08} stroke={theme.inkDim} strokeWidth={THIN} />
        <Line x1={len} y1={-0.08} x2={len} y2={0.08} stroke={theme.inkDim} strokeWidth={THIN} />
      </G>
      <G x={(item.a.x + item.b.x) / 2} y={(item.a.y + item.b.y) / 2} rotation={upright}>
        <SvgText x={0} y={-0.06} fontSize={LABEL_SIZE * 0.9} fill={theme.ink} textAnchor="middle" fontFamily="IBMPlexMono_400Regular">
          {formatLength(len, units)}
        </SvgText>
      </G>
    </G>
  );
});

export const ArrowView = memo(function ArrowView({ item, theme }: ViewProps<ItemOf<'arrow'>>) {
  const len = Math.hypot(item.b.x - item.a.x, item.b.y - item.a.y);
  const ang = deg(Math.atan2(item.b.y - item.a.y, item.b.x - item.a.x));
  return (
    <G x={item.a.x} y={item.a.y} rotation={ang}>
      <Line x1={0} y1={0} x2={Math.max(0, len - 0.12)} y2={0} stroke={theme.ink} strokeWidth={STROKE} />
      <Polygon points={`${len},0 ${len - 0.16},-0.07 ${len - 0.16},0.07`} fill={theme.ink} />
    </G>
  );
});

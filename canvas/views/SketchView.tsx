// Draws a sketch (drawing/) with react-native-svg.
import { memo, type ComponentType } from 'react';
import { Circle, Ellipse, G, Image, Line, Path, Polygon, Polyline, Rect, Text } from 'react-native-svg';
import type { SvgNode, Tag } from '../../drawing/nodes';

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each SVG element takes its own props; drawing/nodes types the attributes
const components: Record<Tag, ComponentType<any>> = {
  g: G,
  line: Line,
  circle: Circle,
  ellipse: Ellipse,
  rect: Rect,
  path: Path,
  polygon: Polygon,
  polyline: Polyline,
  text: Text,
  image: Image,
};

export const SketchView = memo(function SketchView({ node }: { node: SvgNode }) {
  const C = components[node.tag];
  if (node.text !== undefined) return <C {...node.attrs}>{node.text}</C>;
  return (
    <C {...node.attrs}>
      {node.children?.map((c, k) => (
        <SketchView key={k} node={c} />
      ))}
    </C>
  );
});

// Draws a sketch (canvas/sketch) with react-native-svg.
import { memo, type ComponentType } from 'react';
import { Circle, Ellipse, G, Image, Line, Path, Polygon, Polyline, Rect, Text } from 'react-native-svg';
import type { SvgNode, Tag } from '../sketch/nodes';

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

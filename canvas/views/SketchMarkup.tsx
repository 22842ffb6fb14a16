// Draws a sketch that changes often and wholesale (the light map's lines, about thirty times a second while a
// hand drags): on the web, as SVG markup written into one group — a single parse of a short string — where
// SketchView would make React re-render a component per line and react-native-svg prepare each one's props.
// Elsewhere (native) it is SketchView. The group is React's, its contents are not: React renders the group
// without children, so it never reconciles what is written into it.
import { memo, useLayoutEffect, useRef } from 'react';
import { Platform } from 'react-native';
import { G } from 'react-native-svg';
import type { SvgNode } from '../../drawing/nodes';
import { nodeToSvg } from '../../drawing/toSvg';
import { domOf } from './dom';
import { SketchView } from './SketchView';


export const SketchMarkup = memo(function SketchMarkup({ node, testID }: { node: SvgNode; testID?: string }) {
  const group = useRef<unknown>(null);
  useLayoutEffect(() => {
    const el = domOf(group.current);
    if (el) el.innerHTML = nodeToSvg(node);
  }, [node]);
  if (Platform.OS !== 'web') return <SketchView node={node} />;
  return <G ref={group as never} testID={testID} />;
});

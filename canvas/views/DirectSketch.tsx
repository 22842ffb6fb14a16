// Draws a sketch that changes often and wholesale (the light map's lines, about thirty times a second while a
// hand drags): on the web, written straight into one group's DOM — only what changed since the last sketch
// (svgPatch.ts) — where SketchView would make React re-render a component per line and react-native-svg
// prepare each one's props. Elsewhere (native) it is SketchView. The group is React's, its contents are not:
// React renders the group without children, so it never reconciles what is written into it.
import { memo, useLayoutEffect, useRef } from 'react';
import { Platform } from 'react-native';
import { G } from 'react-native-svg';
import type { SvgNode } from '../../drawing/nodes';
import { domOf } from './dom';
import { patchChildren } from './svgPatch';
import { SketchView } from './SketchView';

export const DirectSketch = memo(function DirectSketch({ node, testID }: { node: SvgNode; testID?: string }) {
  const group = useRef<unknown>(null);
  // What the group's DOM draws now (undefined: nothing written yet).
  const drawn = useRef<SvgNode[] | undefined>(undefined);
  useLayoutEffect(() => {
    const el = domOf(group.current) as unknown as Element | null;
    if (!el || typeof el.appendChild !== 'function') return;
    const next = [node];
    patchChildren(el, drawn.current, next);
    drawn.current = next;
  }, [node]);
  if (Platform.OS !== 'web') return <SketchView node={node} />;
  return <G ref={group as never} testID={testID} />;
});

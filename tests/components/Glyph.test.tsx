import { render } from '@testing-library/react';
import type { ReactTestRendererJSON } from 'react-test-renderer';
import { Mark, NavGlyph, type NavGlyphName } from '../../components/Glyph';

/** Every host node of the rendered tree, depth first (react-native-svg renders native RNSVG* host components). */
function nodes(tree: ReturnType<ReturnType<typeof render>['toJSON']>): ReactTestRendererJSON[] {
  const out: ReactTestRendererJSON[] = [];
  const walk = (n: ReactTestRendererJSON | string) => {
    if (typeof n === 'string') return;
    out.push(n);
    n.children?.forEach(walk);
  };
  (Array.isArray(tree) ? tree : tree ? [tree] : []).forEach(walk);
  return out;
}

const types = (tree: Parameters<typeof nodes>[0]) => nodes(tree).map((n) => n.type);

/** react-native-svg hands colours to the native side as 0xAARRGGBB. */
const argb = (hex: string) => (0xff000000 | parseInt(hex.slice(1), 16)) >>> 0;

describe('Mark', () => {
  it('draws the point source and one falloff ring per stop, in the given colour and size', () => {
    const { toJSON } = render(<Mark size={40} colour="#123456" />);
    const all = nodes(toJSON());
    const svg = all[0]!;
    expect(svg.type).toBe('RNSVGSvgView');
    expect(svg.props).toMatchObject({ width: 40, height: 40, vbWidth: 32, vbHeight: 32 });
    expect(svg.props.accessibilityElementsHidden).toBe(true);

    const source = all.filter((n) => n.type === 'RNSVGCircle');
    const rings = all.filter((n) => n.type === 'RNSVGPath');
    expect(source).toHaveLength(1);
    expect(source[0]!.props.fill).toEqual({ type: 0, payload: argb('#123456') });
    expect(rings).toHaveLength(3);
    for (const ring of rings) expect(ring.props.stroke).toEqual({ type: 0, payload: argb('#123456') });
    // Rings fade with distance, as light does.
    const opacities = rings.map((r) => r.props.opacity as number);
    expect(opacities).toEqual([...opacities].sort((a, b) => b - a));
  });
});

describe('NavGlyph', () => {
  it.each<[NavGlyphName, string[]]>([
    ['setups', ['RNSVGRect', 'RNSVGCircle', 'RNSVGPath']],
    ['classes', ['RNSVGRect', 'RNSVGLine', 'RNSVGLine', 'RNSVGLine', 'RNSVGLine']],
    ['account', ['RNSVGCircle', 'RNSVGPath']],
  ])('draws the %s glyph', (name, shapes) => {
    const { toJSON } = render(<NavGlyph name={name} colour="#ffffff" size={24} />);
    expect(types(toJSON())).toEqual(['RNSVGSvgView', 'RNSVGGroup', ...shapes]);
  });
});

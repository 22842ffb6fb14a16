import { render } from '@testing-library/react';
import { Mark, NavGlyph, type NavGlyphName } from '../../components/Glyph';

/** The shapes inside the drawing, in document order (react-native-svg draws real SVG elements on the web). */
const shapes = (svg: SVGSVGElement) => Array.from(svg.querySelectorAll('*')).map((n) => n.tagName.toLowerCase());

describe('Mark', () => {
  it('draws the point source and one falloff ring per stop, in the given colour and size', () => {
    const { container } = render(<Mark size={40} colour="#123456" />);
    const svg = container.querySelector('svg')!;
    expect(svg).toBeTruthy();
    expect(svg).toHaveAttribute('width', '40');
    expect(svg).toHaveAttribute('height', '40');
    expect(svg).toHaveAttribute('viewBox', '0 0 32 32');
    // Decoration: hidden from assistive tech (the text beside it says what it is).
    expect(svg.closest('[aria-hidden="true"]')).toBeTruthy();

    const source = Array.from(svg.querySelectorAll('circle'));
    const rings = Array.from(svg.querySelectorAll('path'));
    expect(source).toHaveLength(1);
    expect(source[0]).toHaveAttribute('fill', '#123456');
    expect(rings).toHaveLength(3);
    for (const ring of rings) expect(ring).toHaveAttribute('stroke', '#123456');
    // Rings fade with distance, as light does.
    const opacities = rings.map((r) => Number(r.getAttribute('opacity')));
    expect(opacities.every((o) => o > 0 && o <= 1)).toBe(true);
    expect(opacities).toEqual([...opacities].sort((a, b) => b - a));
    expect(new Set(opacities).size).toBe(3);
  });
});

describe('NavGlyph', () => {
  it.each<[NavGlyphName, string[]]>([
    ['setups', ['rect', 'circle', 'path']],
    ['classes', ['rect', 'line', 'line', 'line', 'line']],
    ['account', ['circle', 'path']],
  ])('draws the %s glyph', (name, expected) => {
    const { container } = render(<NavGlyph name={name} colour="#ffffff" size={24} />);
    expect(shapes(container.querySelector('svg')!)).toEqual(expected);
  });
});

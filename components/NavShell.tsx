// The signed-in frame: a bottom bar on a phone, a side rail on a wide screen.
import { Link, usePathname } from 'expo-router';
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { WIDE_MIN, colours, fonts, space } from '../constants/theme';
import { Mark, NavGlyph, type NavGlyphName } from './Glyph';
import { OfflineBanner } from './offline/OfflineBanner';

const destinations: { href: '/setups' | '/classes' | '/account'; label: string; glyph: NavGlyphName }[] = [
  { href: '/setups', label: 'Setups', glyph: 'setups' },
  { href: '/classes', label: 'Classes', glyph: 'classes' },
  { href: '/account', label: 'Account', glyph: 'account' },
];

export function NavShell({ children }: { children: ReactNode }) {
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_MIN;
  const path = usePathname();
  const insets = useSafeAreaInsets();
  // The editor takes the whole screen; its own top bar leads back to the library.
  const immersive = /^\/setups\/[^/]+/.test(path);
  const items = destinations.map((d) => {
    const active = path === d.href || path.startsWith(`${d.href}/`);
    const colour = active ? colours.accent : colours.textDim;
    return (
      <Link key={d.href} href={d.href} asChild>
        <Pressable
          accessibilityRole="link"
          accessibilityLabel={d.label}
          accessibilityState={{ selected: active }}
          // react-native-web reads aria-* props, not accessibilityState: the page a link leads to is the current one.
          aria-current={active ? 'page' : undefined}
          // Link's asChild hands the style to the DOM as is on web, so it must be one object.
          style={StyleSheet.flatten([wide ? s.railItem : s.barItem, active && wide && s.railActive])}
        >
          <NavGlyph name={d.glyph} colour={colour} />
          <Text style={[s.itemText, { color: colour }, wide && { fontSize: 15 }]}>{d.label}</Text>
        </Pressable>
      </Link>
    );
  });

  // One tree for both layouts, so the screen below (and its navigation state) survives a resize.
  return (
    <View style={[s.root, wide && { flexDirection: 'row' }]}>
      {wide && !immersive ? (
        <View style={s.rail} role="navigation">
          <View style={s.brand}>
            <Mark size={30} />
            <Text style={s.brandText}>Falloff</Text>
          </View>
          {items}
        </View>
      ) : null}
      <View style={s.main}>
        {immersive ? null : <OfflineBanner />}
        {children}
      </View>
      {wide || immersive ? null : (
        <View style={[s.bar, { paddingBottom: Math.max(insets.bottom, space.sm) }]} role="navigation">
          {items}
        </View>
      )}
    </View>
  );
}

const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  main: { flex: 1 },
  rail: { width: 220, backgroundColor: colours.panel, borderRightWidth: 1, borderRightColor: colours.line, paddingTop: space.xl, paddingHorizontal: space.md, gap: space.xs },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.sm, marginBottom: space.xl },
  brandText: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 20, letterSpacing: 0.5 },
  railItem: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.md, paddingHorizontal: space.md, borderRadius: 10 },
  railActive: { backgroundColor: colours.panelRaised },
  bar: { flexDirection: 'row', backgroundColor: colours.panel, borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.sm },
  barItem: { flex: 1, alignItems: 'center', gap: 2, minHeight: 48, justifyContent: 'center' },
  itemText: { fontFamily: fonts.sansMedium, fontSize: 12 },
});

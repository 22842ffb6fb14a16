// The DOM element behind a react-native-svg element on the web, for the views that write SVG directly.

/** What the plan's direct writers use of an SVG element. */
export type DomLike = { setAttribute(name: string, value: string): void; removeAttribute(name: string): void; innerHTML: string };

/** The DOM element behind a react-native-svg element on the web (its `elementRef`), or null elsewhere. */
export function domOf(instance: unknown): DomLike | null {
  const el = (instance as { elementRef?: { current?: unknown } } | null)?.elementRef?.current as DomLike | undefined;
  return el && typeof el.setAttribute === 'function' ? el : null;
}

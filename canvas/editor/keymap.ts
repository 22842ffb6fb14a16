// The one key map: built from the actions' own `shortcut` fields, so a shortcut is declared once, beside the
// action it runs. A key press is normalised to "Mod+Shift+Key" (Mod is Ctrl, or Cmd on a Mac) and looked up.
import { actions, type ActionName } from './actions';

export type KeyInput = { key: string; shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey?: boolean };
export type KeyBinding = { action: ActionName; arg: unknown };

/** "Shift+mod+z" → "Mod+Shift+z": modifiers in a fixed order, single characters lower-cased. */
function normaliseCombo(combo: string): string {
  const parts = combo.split('+');
  // "+" itself is a key: "Mod++" ends in an empty part.
  let key = parts.pop()!;
  if (key === '' && parts.at(-1) === '') {
    parts.pop();
    key = '+';
  }
  const mods = new Set(parts.map((p) => p.toLowerCase()));
  return [mods.has('mod') ? 'Mod' : '', mods.has('alt') ? 'Alt' : '', mods.has('shift') ? 'Shift' : '', key.length === 1 ? key.toLowerCase() : key].filter(Boolean).join('+');
}

/** The combo a key press makes. Shift is part of the combo only for keys whose character it does not change
 *  (letters, arrows, Delete): Shift+= types "+", which is its own key. */
function comboOf(e: KeyInput): string {
  const printable = e.key.length === 1;
  const shiftCounts = !printable || e.key.toLowerCase() !== e.key.toUpperCase();
  return normaliseCombo([e.ctrlKey || e.metaKey ? 'Mod' : '', e.altKey ? 'Alt' : '', e.shiftKey && shiftCounts ? 'Shift' : '', e.key === '+' ? '' : e.key].filter(Boolean).join('+') + (e.key === '+' ? '++' : ''));
}

function buildKeymap(): Map<string, KeyBinding> {
  const map = new Map<string, KeyBinding>();
  for (const [name, a] of Object.entries(actions) as [ActionName, { shortcut?: (string | { keys: string; arg: unknown })[] }][]) {
    for (const sc of a.shortcut ?? []) {
      const combo = normaliseCombo(typeof sc === 'string' ? sc : sc.keys);
      if (map.has(combo)) throw new Error(`shortcut ${combo} is bound twice (${map.get(combo)!.action} and ${name})`);
      map.set(combo, { action: name, arg: typeof sc === 'string' ? undefined : sc.arg });
    }
  }
  return map;
}

export const keymap: ReadonlyMap<string, KeyBinding> = buildKeymap();

/** The binding for a key press, or null when the key is not an editor shortcut. */
export function bindingFor(e: KeyInput): KeyBinding | null {
  return keymap.get(comboOf(e)) ?? null;
}

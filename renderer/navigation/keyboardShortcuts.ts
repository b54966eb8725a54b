import { VIEWS, type ViewId } from './views.ts';

/** What a key press asks for, app-wide. */
export type ShortcutAction =
  | { readonly kind: 'open-view'; readonly view: ViewId }
  | { readonly kind: 'toggle-night' };

/** The fields of a KeyboardEvent the shortcuts read. */
export interface KeyPress {
  readonly key: string;
  readonly code: string;
  readonly altKey: boolean;
  readonly ctrlKey: boolean;
  readonly metaKey: boolean;
  readonly shiftKey: boolean;
}

/** Shown in the footer and on the tabs; keep in step with shortcutFor. */
export const SHORTCUT_HELP = [
  { keys: 'Alt+1 … Alt+5', action: 'open a view' },
  { keys: 'Alt+N', action: 'red night mode on/off' },
  { keys: '← →, Home, End', action: 'move along the view tabs' },
] as const;

/**
 * The app-wide shortcut a key press means, or null. Reads `code` (the physical key) so that the
 * shortcuts work on every keyboard layout and with Alt producing a special character on macOS.
 */
export function shortcutFor(press: KeyPress): ShortcutAction | null {
  if (!press.altKey || press.ctrlKey || press.metaKey || press.shiftKey) return null;
  const digit = /^Digit([1-9])$/.exec(press.code)?.[1];
  const view = VIEWS.find((info) => info.shortcutDigit === digit);
  if (view !== undefined) return { kind: 'open-view', view: view.id };
  if (press.code === 'KeyN') return { kind: 'toggle-night' };
  return null;
}

/** The five main views (DESIGN.md §6), in the order of the tab list and of Alt+1 … Alt+5. */
export const VIEW_IDS = ['tonight', 'archive', 'solve', 'signatures', 'exchange'] as const;
export type ViewId = (typeof VIEW_IDS)[number];

export interface ViewInfo {
  readonly id: ViewId;
  readonly label: string;
  /** The digit that, with Alt, opens the view. */
  readonly shortcutDigit: string;
}

export const VIEWS: readonly ViewInfo[] = [
  { id: 'tonight', label: 'Tonight', shortcutDigit: '1' },
  { id: 'archive', label: 'Archive', shortcutDigit: '2' },
  { id: 'solve', label: 'Solve', shortcutDigit: '3' },
  { id: 'signatures', label: 'Signatures', shortcutDigit: '4' },
  { id: 'exchange', label: 'Exchange', shortcutDigit: '5' },
];

export const DEFAULT_VIEW: ViewId = 'tonight';

function isViewId(value: string): value is ViewId {
  return (VIEW_IDS as readonly string[]).includes(value);
}

/** The view a location hash names (`#/archive`, also `#archive`); unknown or empty → null. */
export function viewFromHash(hash: string): ViewId | null {
  const name = hash.replace(/^#\/?/, '').split(/[/?]/)[0].toLowerCase();
  return isViewId(name) ? name : null;
}

/** The location hash for a view: `#/archive`. */
export function hashForView(view: ViewId): string {
  return `#/${view}`;
}

/** The view `steps` places along the tab list from `view`, wrapping at both ends (arrow keys). */
export function neighbourView(view: ViewId, steps: number): ViewId {
  const index = VIEW_IDS.indexOf(view);
  const count = VIEW_IDS.length;
  return VIEW_IDS[(((index + steps) % count) + count) % count];
}

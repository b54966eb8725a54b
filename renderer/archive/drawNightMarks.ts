import type { NightsLayout } from './nightsLayout.ts';
import type { OverviewGeometry } from './overviewGeometry.ts';
import type { UweClass } from './uweClasses.ts';

/** The theme colours the marks are painted in (CSS colour strings from the theme's variables). */
export interface MarkColours {
  /** Transit-count colouring. */
  readonly count: string;
  /** Unit-weight-error colouring (a sequential scale of this one colour). */
  readonly uwe: string;
  readonly notReduced: string;
  /** The outline of the open night. */
  readonly selected: string;
}

/** Opacity of each transit-count step (0.25 + 0.75·step/4) and of each UWE class 0…3. */
export const COUNT_OPACITY = [0.25, 0.4375, 0.625, 0.8125, 1] as const;
export const UWE_OPACITY = [0.3, 0.5, 0.75, 1] as const;

export interface MarkPaint {
  readonly colourBy: 'uwe' | 'count';
  readonly classOf: (index: number) => UweClass;
  readonly selectedIndex: number | null;
  readonly colours: MarkColours;
}

/**
 * Paints every night's mark on a 2-D canvas whose transform maps drawing units to pixels; marks
 * of one colour and opacity are filled together (10,000 marks take a few ms, where as many svg
 * rects took hundreds of ms per batch of 700 to lay out). A night not reduced is a lower
 * half-height mark in the muted colour, told apart by shape as well as colour. Returns how many
 * marks each class (or count step) got, for the figure's data attributes.
 */
export function drawNightMarks(context: CanvasRenderingContext2D, layout: NightsLayout, geometry: OverviewGeometry, paint: MarkPaint): Map<string, number> {
  const groups = new Map<string, number[]>();
  layout.marks.forEach((mark, index) => {
    const key = paint.colourBy === 'count' ? `step-${mark.step}` : String(paint.classOf(index));
    const list = groups.get(key);
    if (list === undefined) groups.set(key, [index]);
    else list.push(index);
  });
  for (const [key, indices] of groups) {
    const notReduced = key === 'not-reduced';
    context.fillStyle = paint.colourBy === 'count' ? paint.colours.count : notReduced ? paint.colours.notReduced : paint.colours.uwe;
    context.globalAlpha = paint.colourBy === 'count' ? COUNT_OPACITY[Number(key.slice(5))] : notReduced ? 1 : UWE_OPACITY[Number(key)];
    for (const index of indices) {
      const box = geometry.box(layout.marks[index]);
      if (notReduced) context.fillRect(box.x, box.y + box.height / 2, box.width, box.height / 2);
      else context.fillRect(box.x, box.y, box.width, box.height);
    }
  }
  context.globalAlpha = 1;
  if (paint.selectedIndex !== null && layout.marks[paint.selectedIndex] !== undefined) {
    const box = geometry.box(layout.marks[paint.selectedIndex]);
    context.strokeStyle = paint.colours.selected;
    context.lineWidth = 1.2;
    context.strokeRect(box.x - 0.6, box.y - 0.6, box.width + 1.2, box.height + 1.2);
  }
  return new Map([...groups].map(([key, indices]) => [key, indices.length]));
}

/** The mark colours of the theme now on <html> (its CSS variables), so night mode stays red on the canvas too. */
export function themeMarkColours(): MarkColours {
  const style = getComputedStyle(document.documentElement);
  const read = (name: string) => {
    const value = style.getPropertyValue(name).trim();
    if (value === '') throw new Error(`The theme defines no ${name}; add it to renderer/styles/themes.css for every theme.`);
    return value;
  };
  return { count: read('--accent'), uwe: read('--danger'), notReduced: read('--text-muted'), selected: read('--focus') };
}

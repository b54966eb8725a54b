import type { Page } from '@playwright/test';

/** A colour the night theme must not show: where it was, which property, and its value. */
export interface ColourViolation {
  readonly where: string;
  readonly property: string;
  readonly value: string;
}

/**
 * Every computed colour of every element (and of the root's scrollbar, caret and selection)
 * whose green or blue channel exceeds `limit` (0–255). Night mode must return none.
 */
export function findNonRedColours(page: Page, limit: number): Promise<ColourViolation[]> {
  return page.evaluate((channelLimit) => {
    const properties = [
      'color', 'background-color', 'border-top-color', 'border-right-color', 'border-bottom-color',
      'border-left-color', 'outline-color', 'caret-color', 'accent-color', 'text-decoration-color',
      'column-rule-color', 'fill', 'stroke',
    ];
    const violations: { where: string; property: string; value: string }[] = [];
    const check = (where: string, property: string, value: string) => {
      if (/(color|oklab|oklch|lab|lch|hsl)\(/.test(value)) violations.push({ where, property, value: `unparsed ${value}` });
      for (const match of value.matchAll(/rgba?\(([^)]+)\)/g)) {
        const parts = match[1].split(/[\s,/]+/).filter((part) => part !== '').map(Number);
        const [, green, blue] = parts;
        const alpha = parts.length > 3 ? parts[3] : 1;
        if (alpha > 0 && (green > channelLimit || blue > channelLimit)) violations.push({ where, property, value });
      }
    };
    const describe = (element: Element) =>
      `${element.tagName.toLowerCase()}${element.id ? `#${element.id}` : ''}${element.className && typeof element.className === 'string' ? `.${element.className.split(' ')[0]}` : ''}`;
    for (const element of Array.from(document.querySelectorAll('*'))) {
      const style = getComputedStyle(element);
      for (const property of properties) check(describe(element), property, style.getPropertyValue(property));
      for (const pseudo of ['::selection', '::placeholder', '::before', '::after']) {
        const pseudoStyle = getComputedStyle(element, pseudo);
        check(`${describe(element)}${pseudo}`, 'color', pseudoStyle.color);
        check(`${describe(element)}${pseudo}`, 'background-color', pseudoStyle.backgroundColor);
      }
    }
    check('html', 'scrollbar-color', getComputedStyle(document.documentElement).scrollbarColor);
    return violations;
  }, limit);
}

/** Counts screenshot pixels whose green or blue channel exceeds `limit`, and the brightest red. */
export async function scanScreenshot(page: Page, png: Buffer, limit: number) {
  const probe = await page.context().newPage();
  try {
    await probe.setContent('<canvas></canvas>');
    return await probe.evaluate(
      async ({ base64, channelLimit }) => {
        const image = new Image();
        image.src = `data:image/png;base64,${base64}`;
        await image.decode();
        const canvas = document.querySelector('canvas') as HTMLCanvasElement;
        canvas.width = image.width;
        canvas.height = image.height;
        const context = canvas.getContext('2d') as CanvasRenderingContext2D;
        context.drawImage(image, 0, 0);
        const data = context.getImageData(0, 0, image.width, image.height).data;
        let offending = 0;
        let maxRed = 0;
        for (let i = 0; i < data.length; i += 4) {
          if (data[i + 1] > channelLimit || data[i + 2] > channelLimit) offending++;
          if (data[i] > maxRed) maxRed = data[i];
        }
        return { offending, maxRed, pixels: data.length / 4 };
      },
      { base64: png.toString('base64'), channelLimit: limit },
    );
  } finally {
    await probe.close();
  }
}

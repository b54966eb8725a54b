/**
 * Prints a self-contained HTML report from a hidden iframe.
 *
 * The iframe inherits the app's Content-Security-Policy, which refuses inline `<style>` and
 * `style=""`. Styles are therefore moved into the CSSOM (an adopted stylesheet and
 * `element.style.cssText`), which the policy does not govern; scripts in the report never run.
 */
export function printHtml(html: string): void {
  // The <style> blocks are cut out of the text before parsing: a parsed document inherits this
  // page's policy, and Chromium reports every <style> it parses as a violation.
  const styles: string[] = [];
  const withoutStyles = html.replace(/<style\b[^>]*>([\s\S]*?)<\/style\s*>/gi, (_, css: string) => {
    styles.push(css);
    return '';
  });
  const parsed = new DOMParser().parseFromString(withoutStyles, 'text/html');
  const cssText = [...styles, ...Array.from(parsed.querySelectorAll('style'), (style) => style.textContent ?? '')].join('\n');
  parsed.querySelectorAll('style, script').forEach((element) => element.remove());
  // Remember each element's inline style by its position in document order, which importNode keeps.
  const inlineStyles = new Map<number, string>();
  Array.from(parsed.querySelectorAll('*')).forEach((element, position) => {
    const style = element.getAttribute('style');
    if (style !== null) {
      inlineStyles.set(position, style);
      element.removeAttribute('style');
    }
  });

  const frame = document.createElement('iframe');
  frame.setAttribute('aria-hidden', 'true');
  frame.tabIndex = -1;
  frame.style.cssText = 'position:fixed;width:0;height:0;border:0;visibility:hidden';
  document.body.append(frame);
  try {
    const target = frame.contentDocument;
    const view = frame.contentWindow;
    if (target === null || view === null) throw new Error('the print frame has no document');
    target.documentElement.replaceWith(target.importNode(parsed.documentElement, true));
    const copies = target.querySelectorAll<HTMLElement>('*');
    for (const [position, style] of inlineStyles) copies[position].style.cssText = style;
    // A constructed sheet may only be adopted by the document of the window that made it.
    const FrameStyleSheet = (view as unknown as { CSSStyleSheet: typeof CSSStyleSheet }).CSSStyleSheet;
    const sheet = new FrameStyleSheet();
    sheet.replaceSync(cssText);
    target.adoptedStyleSheets = [sheet];
    view.focus();
    view.print();
  } finally {
    frame.remove();
  }
}

// The paper templates print on: the maker's choice (A4 or US Letter), remembered in this
// browser, and the named CSS pages (@page) the printed sheets use. @page rules do not apply
// inside shadow roots, so they live in one style element in the document's head.
import { templatePapers, templateSheet, type TemplatePaper } from '../src/index.ts';

const storageKey = 'barwright.template-paper';

/** The paper chosen last in this browser (A4 when none was chosen or storage is closed). */
export function rememberedPaper(): TemplatePaper {
  try {
    const stored = localStorage.getItem(storageKey);
    return stored && stored in templatePapers ? (stored as TemplatePaper) : 'a4';
  } catch {
    return 'a4';
  }
}

/** Keeps the paper for the next template printed in this browser. */
export function rememberPaper(paper: TemplatePaper): void {
  try {
    localStorage.setItem(storageKey, paper);
  } catch {
    // Private windows may refuse storage: the choice then lasts as long as the view.
  }
}

/** The named page a template sheet prints on (its `page` CSS property). */
export function templatePageName(orientation: 'portrait' | 'landscape'): string {
  return `bw-template-${orientation}`;
}

/** Writes the @page rules of both orientations of `paper` (exact millimetres, the template's margin). */
export function writeTemplatePageRules(paper: TemplatePaper): void {
  let style = document.head.querySelector<HTMLStyleElement>('style[data-barwright="template-pages"]');
  if (!style) {
    style = document.createElement('style');
    style.dataset.barwright = 'template-pages';
    document.head.append(style);
  }
  const { width_mm: width, height_mm: height } = templatePapers[paper];
  const margin = templateSheet.margin_mm;
  style.textContent = [
    `@page ${templatePageName('portrait')} { size: ${width}mm ${height}mm; margin: ${margin}mm; }`,
    `@page ${templatePageName('landscape')} { size: ${height}mm ${width}mm; margin: ${margin}mm; }`,
  ].join('\n');
}

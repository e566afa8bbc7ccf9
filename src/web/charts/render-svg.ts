/**
 * Server side of `FigureSpec`: Observable Plot drawing into a server DOM
 * (linkedom; Plot's `document` option), returned as SVG markup for the page's
 * HTML. Server code only (route pages), never imported by a client module:
 * the browser gets the markup, not linkedom.
 */
import { parseHTML } from 'linkedom';
import * as kit from './plot-kit';
import { finishFigure, plotOptions, type FigureSpec } from './figure-spec';
import { rampCanvas } from './ramp-canvas';

let shared: Document | null = null;

function serverDocument(): Document {
  if (!shared) {
    const doc = parseHTML('<!doctype html><html><body></body></html>').document as unknown as Document;
    const create = doc.createElement.bind(doc);
    // Continuous colour legends draw their ramp on a canvas (see ramp-canvas.ts).
    doc.createElement = ((tag: string, options?: ElementCreationOptions) =>
      tag.toLowerCase() === 'canvas' ? rampCanvas() : create(tag, options)) as Document['createElement'];
    shared = doc;
  }
  return shared;
}

/**
 * Numbers in attribute values to 0.1 px (Plot writes up to 14 decimals): a third of the markup,
 * nothing visible. Links (the legend ramp's image) are left as they are.
 */
function compact(markup: string): string {
  return markup.replace(/([\w:-]+)="([^"]*)"/g, (all, name: string, value: string) =>
    name.endsWith('href') ? all : `${name}="${value.replace(/\d+\.\d{2,}/g, (x) => Number(x).toFixed(1))}"`,
  );
}

/**
 * The figure's SVG markup at `width` px, without hover texts (it scales down
 * with its box until the browser redraws it, texts and all), or null when Plot refuses the data: the browser then
 * draws it and shows Plot's own message.
 */
export function renderFigureSvg(spec: FigureSpec, width: number): string | null {
  try {
    const options = plotOptions(spec.build(kit), { ...spec, width });
    const node = finishFigure(kit.plot({ ...options, document: serverDocument() }) as unknown as Element);
    // Hover texts (one <title> per mark) come with the browser's live drawing; they would double the markup.
    for (const t of Array.from(node.querySelectorAll('title'))) t.remove();
    return compact(node.outerHTML);
  } catch {
    return null;
  }
}

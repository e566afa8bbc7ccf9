/**
 * Getting numbers and figures out: tables as CSV (RFC 4180: comma-separated, fields with a comma,
 * quote or line break in double quotes, quotes doubled, CRLF line ends), figures as standalone SVG
 * (theme colours resolved, so the file looks as on screen) and as PNG at twice the drawn size.
 */

export interface CsvColumn {
  key: string;
  header: string;
  unit?: string;
}

function csvField(v: unknown): string {
  const s =
    v == null
      ? ''
      : v instanceof Date
        ? v.toISOString()
        : typeof v === 'number'
          ? Number.isFinite(v)
            ? String(v)
            : ''
          : String(v);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** CSV text with a header row ("name (unit)") and full-precision numbers. */
export function toCsv(columns: CsvColumn[], rows: Record<string, unknown>[]): string {
  const head = columns.map((c) => csvField(c.unit ? `${c.header} (${c.unit})` : c.header));
  const body = rows.map((r) => columns.map((c) => csvField(r[c.key])).join(','));
  return [head.join(','), ...body].join('\r\n') + '\r\n';
}

/** A file name from a title: lower-case words joined by dashes. */
export function fileName(title: string, ext: string): string {
  const base = title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '');
  return `${base || 'cavitas'}.${ext}`;
}

/** Saves a blob under a name (browser only). */
export function saveBlob(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function saveCsv(title: string, columns: CsvColumn[], rows: Record<string, unknown>[]): void {
  saveBlob(new Blob([toCsv(columns, rows)], { type: 'text/csv;charset=utf-8' }), fileName(title, 'csv'));
}

const PAINT = ['fill', 'stroke', 'stop-color', 'color'] as const;

/** A figure's SVG as a standalone file: CSS variables and currentColor resolved from the page, fonts named. */
export function standaloneSvg(svg: SVGSVGElement): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  const live = [svg, ...Array.from(svg.querySelectorAll('*'))];
  const dead = [copy, ...Array.from(copy.querySelectorAll('*'))];
  live.forEach((el, i) => {
    const style = getComputedStyle(el);
    for (const attr of PAINT) {
      const v = el.getAttribute(attr);
      if (v && (v.includes('var(') || v === 'currentColor')) dead[i].setAttribute(attr, style.getPropertyValue(attr));
    }
  });
  const page = getComputedStyle(svg);
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  copy.setAttribute('font-family', page.fontFamily);
  copy.setAttribute('font-size', page.fontSize);
  copy.setAttribute('color', page.color);
  const box = svg.getBoundingClientRect();
  copy.setAttribute('width', String(Math.round(box.width)));
  copy.setAttribute('height', String(Math.round(box.height)));
  const background = document.createElementNS('http://www.w3.org/2000/svg', 'rect');
  background.setAttribute('width', '100%');
  background.setAttribute('height', '100%');
  background.setAttribute('fill', getComputedStyle(document.documentElement).backgroundColor);
  copy.insertBefore(background, copy.firstChild);
  return new XMLSerializer().serializeToString(copy);
}

export function saveSvg(title: string, svg: SVGSVGElement): void {
  saveBlob(new Blob([standaloneSvg(svg)], { type: 'image/svg+xml' }), fileName(title, 'svg'));
}

/** The figure drawn onto a canvas at twice its size and saved as PNG. */
export async function savePng(title: string, svg: SVGSVGElement): Promise<void> {
  const text = standaloneSvg(svg);
  const box = svg.getBoundingClientRect();
  const url = URL.createObjectURL(new Blob([text], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.decoding = 'async';
    img.src = url;
    await img.decode();
    const canvas = document.createElement('canvas');
    canvas.width = Math.round(box.width * 2);
    canvas.height = Math.round(box.height * 2);
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new Error('this browser cannot draw on a canvas');
    ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
    const png = await new Promise<Blob | null>((done) => canvas.toBlob(done, 'image/png'));
    if (!png) throw new Error('the PNG could not be made');
    saveBlob(png, fileName(title, 'png'));
  } finally {
    URL.revokeObjectURL(url);
  }
}

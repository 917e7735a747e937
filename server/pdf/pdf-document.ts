import { PDFDocument, rgb, type PDFFont, type PDFPage, type RGB } from 'pdf-lib';
import { fontkit, robotoFiles } from './fonts.js';

const A4: [number, number] = [595.28, 841.89];
const MARGIN = 50;
const TOP = A4[1] - 78;
const BOTTOM = 70;

export const INK = rgb(0.12, 0.16, 0.23);
export const MUTED = rgb(0.38, 0.42, 0.48);
export const WARN = rgb(0.55, 0.33, 0);
export const ALERT = rgb(0.7, 0.15, 0.12);

export interface TextStyle {
  size?: number;
  bold?: boolean;
  color?: RGB;
  indent?: number;
  gapAfter?: number;
}

/** A4 pages of flowing text in embedded Roboto, with a header and a footer drawn on every page at the end. */
export class PdfWriter {
  private page!: PDFPage;
  private y = TOP;
  private constructor(
    readonly doc: PDFDocument,
    private readonly regular: PDFFont,
    private readonly bold: PDFFont,
    private readonly covers: (cp: number) => boolean,
  ) {
    this.addPage();
  }

  static async create(title: string): Promise<PdfWriter> {
    const doc = await PDFDocument.create();
    doc.registerFontkit(fontkit);
    const files = robotoFiles();
    const regular = await doc.embedFont(files.regular, { subset: true });
    const bold = await doc.embedFont(files.bold, { subset: true });
    doc.setTitle(title);
    doc.setProducer('Breakover');
    return new PdfWriter(doc, regular, bold, files.covers);
  }

  /** Characters the font has no glyph for would break the file: they become a visible "?". */
  private clean(s: string): string {
    return [...s.replace(/\t/g, '    ')].map((ch) => (ch === '\n' || this.covers(ch.codePointAt(0)!) ? ch : '?')).join('');
  }

  private addPage() {
    this.page = this.doc.addPage(A4);
    this.y = TOP;
  }

  private wrap(text: string, font: PDFFont, size: number, width: number): string[] {
    const lines: string[] = [];
    for (const para of this.clean(text).split('\n')) {
      let line = '';
      for (const word of para.split(/ +/)) {
        const next = line ? `${line} ${word}` : word;
        if (font.widthOfTextAtSize(next, size) <= width || !line) line = next;
        else {
          lines.push(line);
          line = word;
        }
      }
      lines.push(line);
    }
    return lines;
  }

  text(text: string, style: TextStyle = {}) {
    const size = style.size ?? 10;
    const font = style.bold ? this.bold : this.regular;
    const indent = style.indent ?? 0;
    const lead = size * 1.35;
    for (const line of this.wrap(text, font, size, A4[0] - 2 * MARGIN - indent)) {
      if (this.y - lead < BOTTOM) this.addPage();
      this.y -= lead;
      this.page.drawText(line, { x: MARGIN + indent, y: this.y, size, font, color: style.color ?? INK });
    }
    this.y -= style.gapAfter ?? 2;
  }

  heading(text: string, size = 13) {
    if (this.y - size * 4 < BOTTOM) this.addPage();
    this.y -= 8;
    this.text(text, { size, bold: true, gapAfter: 4 });
  }

  /** An empty square to tick by hand, then the text beside it. */
  box(text: string, style: TextStyle = {}) {
    const size = style.size ?? 10;
    if (this.y - size * 1.35 < BOTTOM) this.addPage();
    this.page.drawRectangle({ x: MARGIN + (style.indent ?? 0), y: this.y - size * 1.2, width: size * 0.8, height: size * 0.8, borderColor: INK, borderWidth: 0.7 });
    this.text(text, { ...style, indent: (style.indent ?? 0) + size * 1.3 });
  }

  rule() {
    this.y -= 4;
    this.page.drawLine({ start: { x: MARGIN, y: this.y }, end: { x: A4[0] - MARGIN, y: this.y }, thickness: 0.5, color: MUTED });
    this.y -= 4;
  }

  /** Header and footer on every page, page numbers included; call once, when the body is complete. */
  async finish(header: (n: number, total: number) => { left: string; right: string; banner?: string }, footer: string[]): Promise<Uint8Array> {
    const pages = this.doc.getPages();
    pages.forEach((page, i) => {
      const h = header(i + 1, pages.length);
      page.drawText(this.clean(h.left), { x: MARGIN, y: A4[1] - 36, size: 8.5, font: this.bold, color: MUTED });
      const rw = this.bold.widthOfTextAtSize(this.clean(h.right), 8.5);
      page.drawText(this.clean(h.right), { x: A4[0] - MARGIN - rw, y: A4[1] - 36, size: 8.5, font: this.bold, color: MUTED });
      if (h.banner) {
        page.drawRectangle({ x: MARGIN, y: A4[1] - 64, width: A4[0] - 2 * MARGIN, height: 20, color: ALERT });
        page.drawText(this.clean(h.banner), { x: MARGIN + 8, y: A4[1] - 58, size: 10, font: this.bold, color: rgb(1, 1, 1) });
      }
      footer.forEach((line, k) => {
        page.drawText(this.clean(line), { x: MARGIN, y: 40 - k * 11, size: 8, font: this.regular, color: MUTED });
      });
      const pn = `Page ${i + 1} of ${pages.length}`;
      page.drawText(pn, { x: A4[0] - MARGIN - this.regular.widthOfTextAtSize(pn, 8), y: 40, size: 8, font: this.regular, color: MUTED });
    });
    return this.doc.save();
  }
}

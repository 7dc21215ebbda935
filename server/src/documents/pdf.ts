import PDFDocument from 'pdfkit';

/**
 * A small layer over pdfkit for our documents: A4, the built-in Helvetica (no font files to
 * ship), headings, paragraphs, label/value rows, tables that break across pages, images, and
 * "page N of M" footers. Text is brought into the built-in fonts' character set first.
 */

const PAGE_MARGIN = 48;
const INK = '#17201b';
const MUTED = '#55625b';
const RULE = '#b9c2bc';
const ACCENT = '#24453a';

/** Characters of WinAnsi (the built-in fonts' encoding) beyond Latin-1. */
const WIN_ANSI_EXTRA = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');
const REPLACE: Record<string, string> = {
  '→': '->',
  '←': '<-',
  '≤': '<=',
  '≥': '>=',
  '≈': '~',
  '✓': 'v',
  '✔': 'v',
  '✗': 'x',
  '−': '-',
  '‐': '-',
  '\u2009': ' ',
  '\u202f': ' ',
};

/** Text the built-in fonts can draw: accents kept where Latin-1 has them, others simplified. */
export function printable(s: string): string {
  let out = '';
  for (const ch of s) {
    const code = ch.codePointAt(0)!;
    if (ch === '\n' || (code >= 0x20 && code < 0x7f) || (code >= 0xa0 && code <= 0xff)) {
      out += ch;
    } else if (WIN_ANSI_EXTRA.has(ch)) {
      out += ch;
    } else if (REPLACE[ch] !== undefined) {
      out += REPLACE[ch];
    } else if (ch === '\t') {
      out += ' ';
    } else {
      const plain = ch.normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
      out += /^[\x20-\x7e]+$/.test(plain) ? plain : '?';
    }
  }
  return out;
}

export interface Column {
  title: string;
  /** Share of the width (they are scaled to fill it). */
  width: number;
  align?: 'left' | 'right' | 'center';
}

export class PdfWriter {
  readonly doc: PDFKit.PDFDocument;
  private readonly footer: string;

  constructor(title: string, footer: string) {
    this.doc = new PDFDocument({
      size: 'A4',
      margin: PAGE_MARGIN,
      bufferPages: true,
      info: { Title: printable(title), Creator: 'Panelpass', Producer: 'Panelpass' },
    });
    this.footer = printable(footer);
    this.doc.font('Helvetica').fontSize(10).fillColor(INK);
  }

  get width(): number {
    return this.doc.page.width - PAGE_MARGIN * 2;
  }

  get left(): number {
    return PAGE_MARGIN;
  }

  private get bottom(): number {
    return this.doc.page.height - PAGE_MARGIN - 18;
  }

  /** Starts a new page unless `height` points still fit on this one. */
  room(height: number): void {
    if (this.doc.y + height > this.bottom) {
      this.doc.addPage();
      this.doc.y = PAGE_MARGIN;
    }
  }

  title(small: string, big: string): void {
    this.doc.font('Helvetica').fontSize(10).fillColor(MUTED).text(printable(small), this.left);
    this.doc.font('Helvetica-Bold').fontSize(22).fillColor(ACCENT).text(printable(big));
    this.doc.moveDown(0.4);
    this.rule();
    this.doc.font('Helvetica').fontSize(10).fillColor(INK);
  }

  heading(text: string): void {
    this.room(60);
    this.doc.moveDown(0.8);
    this.doc.font('Helvetica-Bold').fontSize(13).fillColor(ACCENT).text(printable(text), this.left);
    this.doc.moveDown(0.25);
    this.doc.font('Helvetica').fontSize(10).fillColor(INK);
  }

  para(text: string, opts: { muted?: boolean; size?: number; bold?: boolean } = {}): void {
    this.doc
      .font(opts.bold ? 'Helvetica-Bold' : 'Helvetica')
      .fontSize(opts.size ?? 10)
      .fillColor(opts.muted ? MUTED : INK)
      .text(printable(text), this.left, undefined, { width: this.width });
    this.doc.font('Helvetica').fontSize(10).fillColor(INK);
  }

  bullets(items: string[]): void {
    this.doc.font('Helvetica').fontSize(10);
    for (const item of items) {
      this.room(24);
      const y = this.doc.y;
      this.doc.circle(this.left + 4, y + 5, 1.8).fill(INK);
      this.doc
        .fillColor(INK)
        .text(printable(item), this.left + 14, y, { width: this.width - 14 })
        .moveDown(0.2);
    }
  }

  /** Label and value rows, the labels in a narrow column. */
  facts(rows: [string, string][], labelWidth = 110): void {
    for (const [label, value] of rows) {
      this.room(16);
      const y = this.doc.y;
      this.doc
        .font('Helvetica-Bold')
        .fontSize(10)
        .fillColor(MUTED)
        .text(printable(label), this.left, y, {
          width: labelWidth - 8,
        });
      const afterLabel = this.doc.y;
      this.doc
        .font('Helvetica')
        .fillColor(INK)
        .text(printable(value || '-'), this.left + labelWidth, y, {
          width: this.width - labelWidth,
        });
      this.doc.y = Math.max(this.doc.y, afterLabel);
    }
  }

  rule(): void {
    const y = this.doc.y + 2;
    this.doc
      .moveTo(this.left, y)
      .lineTo(this.left + this.width, y)
      .lineWidth(0.7)
      .strokeColor(RULE)
      .stroke();
    this.doc.y = y + 6;
  }

  /** A table; the header row is repeated on each new page. */
  table(columns: Column[], rows: string[][], opts: { fontSize?: number } = {}): void {
    const size = opts.fontSize ?? 9;
    const total = columns.reduce((a, c) => a + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const pad = 4;
    const drawRow = (cells: string[], bold: boolean) => {
      this.doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(size);
      const heights = cells.map((c, i) =>
        this.doc.heightOfString(printable(c), { width: widths[i]! - pad * 2 }),
      );
      const h = Math.max(...heights, size) + pad * 2;
      return {
        h,
        draw: (y: number) => {
          this.doc.font(bold ? 'Helvetica-Bold' : 'Helvetica').fontSize(size);
          let x = this.left;
          cells.forEach((c, i) => {
            this.doc.fillColor(bold ? ACCENT : INK).text(printable(c), x + pad, y + pad, {
              width: widths[i]! - pad * 2,
              align: columns[i]!.align ?? 'left',
            });
            x += widths[i]!;
          });
          this.doc
            .moveTo(this.left, y + h)
            .lineTo(this.left + this.width, y + h)
            .lineWidth(bold ? 0.9 : 0.4)
            .strokeColor(RULE)
            .stroke();
          this.doc.y = y + h;
        },
      };
    };
    const header = () => {
      const row = drawRow(
        columns.map((c) => c.title),
        true,
      );
      this.room(row.h + 20);
      row.draw(this.doc.y);
    };
    header();
    for (const cells of rows) {
      const row = drawRow(cells, false);
      if (this.doc.y + row.h > this.bottom) {
        this.doc.addPage();
        this.doc.y = PAGE_MARGIN;
        header();
      }
      row.draw(this.doc.y);
    }
    this.doc.font('Helvetica').fontSize(10).fillColor(INK);
    this.doc.x = this.left;
    this.doc.moveDown(0.4);
  }

  /** Draws an image at (x, y) fitted into w × h; false when the bytes are not a JPEG or PNG. */
  image(bytes: Buffer, x: number, y: number, w: number, h: number): boolean {
    try {
      this.doc.image(bytes, x, y, { fit: [w, h], align: 'center', valign: 'center' });
      return true;
    } catch {
      return false;
    }
  }

  /** Writes the footers and answers the file. */
  finish(): Promise<Buffer> {
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve, reject) => {
      this.doc.on('data', (c: Buffer) => chunks.push(c));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
    });
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      // Below the bottom margin: lift it, or pdfkit would start a new page for the footer.
      this.doc.page.margins.bottom = 0;
      const y = this.doc.page.height - PAGE_MARGIN + 6;
      this.doc
        .font('Helvetica')
        .fontSize(8)
        .fillColor(MUTED)
        .text(`${this.footer}  ·  page ${i + 1} of ${range.count}`, this.left, y, {
          width: this.width,
          align: 'center',
          lineBreak: false,
          height: 12,
        });
    }
    this.doc.end();
    return done;
  }
}

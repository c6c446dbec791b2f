import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';
import QRCode from 'qrcode';
import { sourceLanguage } from '@shared/i18n/languages';
import { englishPrint, type PrintWords } from './print-words';

// The frame every printed record shares: the operator and title on top, a QR code that opens the record on the
// desk, and on every page "Page N of M" with the record's signature hash, so a loose page still names its record.

const A4_MARGIN = 48;
const FOOTER_HEIGHT = 28;

/** Barlow, the product's typeface, from the npm package the client already ships (fontkit reads WOFF). */
function barlowFiles(): { regular: string; bold: string } | null {
  try {
    const pkg = createRequire(import.meta.url).resolve('@fontsource/barlow/package.json');
    const folder = join(dirname(pkg), 'files');
    const regular = join(folder, 'barlow-latin-400-normal.woff');
    const bold = join(folder, 'barlow-latin-600-normal.woff');
    return existsSync(regular) && existsSync(bold) ? { regular, bold } : null;
  } catch {
    return null;
  }
}

export interface RecordHeading {
  operator: string;
  title: string;
  /** The line under the title, e.g. the registration mark, fleet number and type. */
  subtitle: string;
  /** The record's signature hash, printed in every page's footer. */
  hash: string;
  /** The desk address of the record, encoded in the QR code. */
  deskUrl: string;
  /** The language the record is printed in; English when not given. */
  words?: PrintWords;
}

export class RecordDocument {
  readonly doc: PDFKit.PDFDocument;
  private readonly regular: string;
  private readonly bold: string;
  private readonly chunks: Buffer[] = [];
  private readonly ended: Promise<void>;
  private readonly words: PrintWords;

  private constructor(private readonly heading: RecordHeading) {
    this.words = heading.words ?? englishPrint();
    this.doc = new PDFDocument({
      size: 'A4',
      margins: { top: A4_MARGIN, left: A4_MARGIN, right: A4_MARGIN, bottom: A4_MARGIN + FOOTER_HEIGHT },
      bufferPages: true,
      info: {
        Title: `${heading.title}, ${heading.subtitle}`,
        Author: heading.operator,
        Creator: 'Gaugewalk',
      },
      lang: heading.words?.language ?? sourceLanguage,
    });
    this.doc.on('data', (chunk: Buffer) => this.chunks.push(chunk));
    this.ended = new Promise<void>((resolve, reject) => {
      this.doc.on('end', resolve);
      this.doc.on('error', reject);
    });
    const fonts = barlowFiles();
    if (fonts) {
      this.doc.registerFont('Body', fonts.regular);
      this.doc.registerFont('Strong', fonts.bold);
    }
    this.regular = fonts ? 'Body' : 'Helvetica';
    this.bold = fonts ? 'Strong' : 'Helvetica-Bold';
  }

  static async open(heading: RecordHeading): Promise<RecordDocument> {
    const record = new RecordDocument(heading);
    const qr = await QRCode.toBuffer(heading.deskUrl, {
      type: 'png',
      errorCorrectionLevel: 'M',
      margin: 1,
      width: 240,
    });
    const { doc } = record;
    const size = 84;
    doc.image(qr, doc.page.width - A4_MARGIN - size, A4_MARGIN, { width: size, height: size });
    const width = doc.page.width - 2 * A4_MARGIN - size - 12;
    doc
      .font(record.regular)
      .fontSize(10)
      .fillColor('#333')
      .text(heading.operator, A4_MARGIN, A4_MARGIN, { width });
    doc.font(record.bold).fontSize(20).fillColor('#000').text(heading.title, { width });
    doc.font(record.regular).fontSize(13).text(heading.subtitle, { width });
    doc.fontSize(8).fillColor('#555').text(record.words.pdf('scanToOpen'), { width });
    doc.fillColor('#000');
    doc.y = Math.max(doc.y, A4_MARGIN + size) + 10;
    return record;
  }

  private get width() {
    return this.doc.page.width - 2 * A4_MARGIN;
  }

  section(title: string): this {
    // A heading is never left alone at the foot of a page.
    if (this.doc.y + 90 > this.doc.page.height - this.doc.page.margins.bottom) this.doc.addPage();
    this.doc
      .moveDown(0.6)
      .font(this.bold)
      .fontSize(13)
      .text(title, A4_MARGIN, this.doc.y, { width: this.width });
    this.doc
      .moveTo(A4_MARGIN, this.doc.y)
      .lineTo(A4_MARGIN + this.width, this.doc.y)
      .lineWidth(0.5)
      .stroke();
    this.doc.moveDown(0.3);
    return this;
  }

  /** Label and value pairs, one a line; a null value is left out. */
  facts(rows: [string, string | null | undefined][]): this {
    for (const [label, value] of rows) {
      if (value === null || value === undefined || value === '') continue;
      this.doc
        .font(this.bold)
        .fontSize(10)
        .text(`${label}: `, A4_MARGIN, this.doc.y, { continued: true, width: this.width });
      this.doc.font(this.regular).text(value);
    }
    return this;
  }

  /** A short heading line in bold with an optional line of detail under it. */
  item(head: string, detail?: string[]): this {
    this.doc
      .moveDown(0.2)
      .font(this.bold)
      .fontSize(10.5)
      .text(head, A4_MARGIN, this.doc.y, { width: this.width });
    for (const line of detail ?? []) {
      if (line)
        this.doc
          .font(this.regular)
          .fontSize(10)
          .text(line, A4_MARGIN + 12, this.doc.y, { width: this.width - 12 });
    }
    return this;
  }

  paragraph(text: string, size = 10): this {
    this.doc.font(this.regular).fontSize(size).text(text, A4_MARGIN, this.doc.y, { width: this.width });
    return this;
  }

  /** A JPEG or PNG thumbnail with its caption; started on a new page when it would not fit. */
  thumbnail(bytes: Buffer, caption: string): this {
    const box = 150;
    if (this.doc.y + box + 30 > this.doc.page.height - this.doc.page.margins.bottom) this.doc.addPage();
    const top = this.doc.y + 4;
    this.doc.image(bytes, A4_MARGIN, top, { fit: [box, box] });
    this.doc
      .font(this.regular)
      .fontSize(9)
      .text(caption, A4_MARGIN + box + 12, top, { width: this.width - box - 12 });
    this.doc.y = top + box + 6;
    this.doc.x = A4_MARGIN;
    return this;
  }

  /** Writes each page's footer and returns the finished file. */
  async finish(): Promise<Buffer> {
    const { doc } = this;
    const range = doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      doc.switchToPage(i);
      const bottom = doc.page.margins.bottom;
      doc.page.margins.bottom = 0;
      const y = doc.page.height - A4_MARGIN - 6;
      doc.font(this.regular).fontSize(8).fillColor('#333');
      doc.text(this.words.pdf('page', { page: i - range.start + 1, pages: range.count }), A4_MARGIN, y, {
        width: this.width,
        lineBreak: false,
      });
      doc.text(this.words.pdf('recordHash', { hash: this.heading.hash }), A4_MARGIN, y + 10, {
        width: this.width,
        lineBreak: false,
      });
      doc.page.margins.bottom = bottom;
    }
    doc.end();
    await this.ended;
    return Buffer.concat(this.chunks);
  }
}

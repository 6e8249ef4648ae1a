import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import type { WindingSheet } from '@shared/shop/sheet';
import { sheetSections } from '@shared/shop/sheet-text';

const require = createRequire(import.meta.url);
const fontFile = (subset: string, weight: number) =>
  require.resolve(`@fontsource/noto-sans/files/noto-sans-${subset}-${weight}-normal.woff`);

// Noto Sans is split into script subsets; Greek letters (Ω, µ is Latin-1) come from the greek subset.
const FONTS = {
  regular: fontFile('latin', 400),
  bold: fontFile('latin', 700),
  greek: fontFile('greek', 400),
};
const isGreek = (ch: string) => /[\u0370-\u03ff]/.test(ch);

function runs(text: string): { greek: boolean; text: string }[] {
  const out: { greek: boolean; text: string }[] = [];
  for (const ch of text) {
    const greek = isGreek(ch);
    const last = out[out.length - 1];
    if (last && last.greek === greek) last.text += ch;
    else out.push({ greek, text: ch });
  }
  return out;
}

/** The winding sheet as a PDF with Noto Sans embedded (shipped with the app, nothing fetched). */
export function renderSheetPdf(sheet: WindingSheet): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 48,
    info: { Title: `${sheet.header.designNumber} rev ${sheet.header.revision} winding sheet`, Creator: 'Gapwright' },
  });
  doc.registerFont('regular', FONTS.regular);
  doc.registerFont('bold', FONTS.bold);
  doc.registerFont('greek', FONTS.greek);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  const write = (text: string, font: 'regular' | 'bold', size: number, options: PDFKit.Mixins.TextOptions = {}) => {
    const parts = runs(text);
    parts.forEach((part, i) => {
      doc
        .font(part.greek ? 'greek' : font)
        .fontSize(size)
        .text(part.text, { ...options, continued: i < parts.length - 1 });
    });
  };

  write(`Winding sheet — ${sheet.header.designNumber} rev ${sheet.header.revision}`, 'bold', 18);
  write(sheet.header.title, 'regular', 11);
  const left = doc.page.margins.left;
  const labelWidth = 110;
  const valueWidth = doc.page.width - doc.page.margins.right - left - labelWidth;
  const boxWidth = valueWidth + labelWidth - 16;

  // The caution comes first, on page one, inside its box: nobody builds from this sheet without seeing it.
  doc.moveDown(0.8);
  const boxTop = doc.y;
  doc.x = left + 8;
  write('Caution', 'bold', 10, { width: boxWidth });
  write(sheet.caution, 'regular', 9, { width: boxWidth });
  doc
    .rect(left, boxTop - 6, valueWidth + labelWidth, doc.y - boxTop + 12)
    .lineWidth(1)
    .stroke('#B5632D');
  doc.x = left;
  doc.moveDown(0.5);

  for (const section of sheetSections(sheet)) {
    doc.moveDown(0.6);
    write(section.title, 'bold', 12);
    for (const [label, value] of section.lines) {
      const y = doc.y;
      doc
        .font('bold')
        .fontSize(9)
        .text(label, left, y, { width: labelWidth - 8 });
      const labelBottom = doc.y;
      doc.y = y;
      doc.x = left + labelWidth;
      write(value, 'regular', 9, { width: valueWidth });
      doc.y = Math.max(doc.y, labelBottom);
      doc.x = left;
    }
  }
  doc.end();
  return done;
}

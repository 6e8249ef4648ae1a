import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import type { WindingSheet } from '@shared/shop/sheet';
import { layoutDrawing, type PlacedDrawing } from '@shared/shop/drawing-layout';
import { sheetSections } from '@shared/shop/sheet-text';
import type { DrawingRole } from '@shared/shop/winding-drawing';
import { windingDrawing } from '@shared/shop/winding-drawing';

const require = createRequire(import.meta.url);
const fontFile = (subset: string, weight: number) =>
  require.resolve(`@fontsource/noto-sans/files/noto-sans-${subset}-${weight}-normal.woff`);

// Noto Sans is split into script subsets; Greek letters (Ω, µ is Latin-1) come from the greek subset.
export const SHEET_FONTS = {
  regular: fontFile('latin', 400),
  bold: fontFile('latin', 700),
  greek: fontFile('greek', 400),
};
export const isGreek = (ch: string) => /[\u0370-\u03ff]/.test(ch);

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

const MARGIN = 48;
/** The band above the content holding the header line, and the gap under the footer's rule (pt). */
const HEADER_BAND = 28;
const FOOTER_GAP = 10;
const CAUTION_SIZE = 6.5;
/** A section title starts a page unless its first lines fit under it (pt of text after the title). */
const KEEP_WITH_TITLE = 2;
const PAGE_WIDTH = 595.28 - 2 * MARGIN; // A4
const DRAWING_BOX = { width: 499, height: 300, fontSize: 8 };

/** Black and greys for the drawing's parts (fill, stroke); the SVG takes the theme's colours instead. */
const PDF_ROLE: Record<DrawingRole, { fill: string | null; stroke: string | null }> = {
  core: { fill: '#c8c8c8', stroke: '#555555' },
  gap: { fill: '#000000', stroke: null },
  bobbin: { fill: '#ececec', stroke: '#888888' },
  tape: { fill: '#f6f6f6', stroke: '#444444' },
  copper: { fill: '#8c8c8c', stroke: '#222222' },
  insulation: { fill: '#ffffff', stroke: '#aaaaaa' },
  'keep-out': { fill: null, stroke: '#000000' },
  axis: { fill: null, stroke: '#000000' },
  dimension: { fill: '#000000', stroke: '#000000' },
};

/** The placed drawing painted with pdfkit's vector calls, its top left corner at (left, top). */
function paintDrawing(doc: PDFKit.PDFDocument, placed: PlacedDrawing, left: number, top: number): void {
  doc.save();
  doc.translate(left, top);
  for (const s of placed.shapes) {
    const { fill, stroke } = PDF_ROLE[s.role];
    doc.lineWidth(s.kind === 'line' && s.thin ? 0.3 : 0.6);
    if (s.kind === 'text') {
      const width = doc.font('regular').fontSize(placed.fontSize).widthOfString(s.text);
      const x = s.anchor === 'start' ? s.x : s.anchor === 'middle' ? s.x - width / 2 : s.x - width;
      if (s.vertical) doc.save().rotate(-90, { origin: [s.x, s.y] });
      doc.fillColor('#000000').text(s.text, x, s.y - placed.fontSize * 0.68, { lineBreak: false });
      if (s.vertical) doc.restore();
      continue;
    }
    if (s.kind === 'line') {
      doc.moveTo(s.x1, s.y1).lineTo(s.x2, s.y2);
      if (s.dashed) doc.dash(6, { space: 2 });
      doc.stroke(stroke ?? '#000000');
      doc.undash();
      continue;
    }
    if (s.kind === 'rect') doc.rect(s.x, s.y, s.width, s.height);
    else if (s.kind === 'circle') doc.circle(s.cx, s.cy, s.r);
    else if (s.kind === 'annulus') doc.circle(s.cx, s.cy, s.r).circle(s.cx, s.cy, s.inner);
    else doc.polygon(...s.points);
    const rule = s.kind === 'annulus' ? 'even-odd' : 'non-zero';
    if (fill && stroke) doc.fillAndStroke(fill, stroke, rule);
    else if (fill) doc.fill(fill, rule);
    else if (stroke) doc.stroke(stroke);
  }
  doc.restore();
  doc.fillColor('#000000');
}

/** What one composition put on its last page: rows written there, and the sections whose title starts there. */
interface Composed {
  doc: PDFKit.PDFDocument;
  lastPageRows: number;
  lastPageSections: string[];
  footerHeight: number;
}

/**
 * The winding sheet as a PDF with Noto Sans embedded (shipped with the app, nothing fetched). Every page carries the
 * design, revision and build order above and "page n of m" with the caution below; a section title never ends a page,
 * and a last page that would hold only a stray row or two takes the section before it along.
 */
export function renderSheetPdf(sheet: WindingSheet): Promise<Buffer> {
  let composed = compose(sheet, null);
  if (composed.lastPageRows <= 2 && composed.lastPageSections.length > 0) {
    const titles = sheetSections(sheet).map((section) => section.title);
    const previous = titles[titles.indexOf(composed.lastPageSections[0]) - 1];
    if (previous) {
      composed.doc.end();
      composed = compose(sheet, previous);
    }
  }
  const { doc } = composed;
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  headersAndFooters(doc, sheet, composed.footerHeight);
  doc.end();
  return done;
}

/** The sheet's content on buffered pages, a new page before the section titled `breakBefore`. */
function compose(sheet: WindingSheet, breakBefore: string | null): Composed {
  const doc = new PDFDocument({
    size: 'A4',
    margin: MARGIN,
    bufferPages: true,
    autoFirstPage: false,
    info: { Title: `${sheet.header.designNumber} rev ${sheet.header.revision} winding sheet`, Creator: 'Gapwright' },
  });
  doc.registerFont('regular', SHEET_FONTS.regular);
  doc.registerFont('bold', SHEET_FONTS.bold);
  doc.registerFont('greek', SHEET_FONTS.greek);

  // The footer's height decides the bottom margin: the caution in full, under the page number.
  const pageWidth = PAGE_WIDTH;
  doc.font('regular').fontSize(CAUTION_SIZE);
  const footerHeight = FOOTER_GAP + 10 + doc.heightOfString(sheet.caution, { width: pageWidth });
  const margins = { top: MARGIN + HEADER_BAND, bottom: MARGIN + footerHeight, left: MARGIN, right: MARGIN };
  let lastPageRows = 0;
  let lastPageSections: string[] = [];
  const newPage = () => {
    doc.addPage({ size: 'A4', margins });
    lastPageRows = 0;
    lastPageSections = [];
  };
  newPage();
  const write = (text: string, font: 'regular' | 'bold', size: number, options: PDFKit.Mixins.TextOptions = {}) => {
    const parts = runs(text);
    parts.forEach((part, i) => {
      doc
        .font(part.greek ? 'greek' : font)
        .fontSize(size)
        .text(part.text, { ...options, continued: i < parts.length - 1 });
    });
  };
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  /** A new page unless `height` more fits on this one. */
  const keep = (height: number) => {
    if (doc.y + height > bottom()) newPage();
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

  const lineHeight = (label: string, value: string) =>
    Math.max(
      doc
        .font('bold')
        .fontSize(9)
        .heightOfString(label || ' ', { width: labelWidth - 8 }),
      doc.font('regular').fontSize(9).heightOfString(value, { width: valueWidth }),
    );
  const title = (text: string, following: number) => {
    if (text === breakBefore) newPage();
    else doc.moveDown(0.6);
    keep(doc.font('bold').fontSize(12).heightOfString(text) + following);
    lastPageSections.push(text);
    write(text, 'bold', 12);
  };

  for (const section of sheetSections(sheet)) {
    const first = section.lines.slice(0, KEEP_WITH_TITLE).reduce((sum, [label, value]) => sum + lineHeight(label, value), 0);
    title(section.title, first);
    for (const [label, value] of section.lines) {
      keep(lineHeight(label, value));
      lastPageRows += 1;
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
    if (section.title === 'Winding' && sheet.drawing) drawingSection(sheet.drawing);
  }

  /** The winding drawing with its notes, kept on one page. */
  function drawingSection(input: NonNullable<WindingSheet['drawing']>) {
    const drawing = windingDrawing(input);
    const placed = layoutDrawing(drawing, DRAWING_BOX);
    const notes = drawing.notes.join(' ');
    const notesHeight = doc.font('regular').fontSize(8).heightOfString(notes, { width: pageWidth });
    title('Winding drawing', (placed.shapes.length ? placed.height : 0) + notesHeight);
    doc.moveDown(0.3);
    if (placed.shapes.length) {
      lastPageRows += drawing.notes.length + 2;
      const top = doc.y;
      paintDrawing(doc, placed, left, top);
      doc.y = top + placed.height;
    }
    doc.x = left;
    write(notes, 'regular', 8, { width: pageWidth });
  }

  return { doc, lastPageRows, lastPageSections, footerHeight };
}

/**
 * Header and footer on every page, in the bands the margins keep free (the margin set to 0 while writing there, so
 * pdfkit does not start a new page for text below the content area).
 */
function headersAndFooters(doc: PDFKit.PDFDocument, sheet: WindingSheet, footerHeight: number): void {
  const left = MARGIN;
  const pageWidth = PAGE_WIDTH;
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const page = doc.page;
    const saved = page.margins.bottom;
    page.margins.bottom = 0;
    const headerY = MARGIN - 4;
    doc.font('bold').fontSize(8).fillColor('#000000');
    doc.text(
      `${sheet.header.designNumber} rev ${sheet.header.revision} · build order ${sheet.header.orderNumber} · winding sheet`,
      left,
      headerY,
      { width: pageWidth, lineBreak: false },
    );
    doc
      .moveTo(left, headerY + 12)
      .lineTo(left + pageWidth, headerY + 12)
      .lineWidth(0.5)
      .stroke('#000000');
    const footerY = page.height - MARGIN - footerHeight + FOOTER_GAP;
    doc
      .moveTo(left, footerY - 4)
      .lineTo(left + pageWidth, footerY - 4)
      .lineWidth(0.5)
      .stroke('#000000');
    doc.font('regular').fontSize(7.5);
    doc.text(`page ${i - range.start + 1} of ${range.count}`, left, footerY, { width: pageWidth, align: 'right', lineBreak: false });
    doc
      .font('regular')
      .fontSize(CAUTION_SIZE)
      .text(sheet.caution, left, footerY + 10, { width: pageWidth });
    page.margins.bottom = saved;
  }
}
